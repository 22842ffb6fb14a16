import { useGlobalSearchParams } from 'expo-router';
import { useHydrated } from './hydration';
import { safeNext } from './safeNext';

/** The safe `?next=` of the current page, or the library. The library until the page has hydrated: the
 *  signed-out pages are rendered at build time, without an address (hooks/hydration.ts). */
export function useReturnPath(): string {
  const { next } = useGlobalSearchParams<{ next?: string }>();
  return safeNext(useHydrated() ? next : undefined);
}
