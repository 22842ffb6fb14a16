// The error boundary Expo Router shows for a route that threw (each route file exports it as
// `ErrorBoundary`): the same message and way back as the app's own boundaries, after open editors save.
import type { ErrorBoundaryProps } from 'expo-router';
import { useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { flushAll } from '../canvas/editor/persist';
import { ErrorPanel } from './ErrorBoundary';

export function RouteError({ error, retry }: ErrorBoundaryProps) {
  const router = useRouter();
  const [saving, setSaving] = useState(true);
  useEffect(() => {
    void flushAll().finally(() => setSaving(false));
  }, []);
  return (
    <ErrorPanel
      what="this page"
      error={error}
      saving={saving}
      onRetry={() => void retry()}
      onLeave={() => void flushAll().finally(() => router.replace('/setups'))}
    />
  );
}
