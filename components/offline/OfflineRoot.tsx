// Mounted once at the root: registers the service worker, sends changes queued without signal when the
// connection comes back (hooks/offline.ts), and says when a new version is waiting for a reload. Loading this
// module (with the root layout) starts watching the browser's Back (hooks/leaveGuard.ts).
import { useEffect } from 'react';
import { guardHistory } from '../../hooks/leaveGuard';
import { registerServiceWorker, useQueueSender } from '../../hooks/offline';
import { UpdateBanner } from './UpdateBanner';

guardHistory();

export function OfflineRoot() {
  useEffect(registerServiceWorker, []);
  useQueueSender();
  return <UpdateBanner />;
}
