import { useGlobalSearchParams } from 'expo-router';
import { safeNext } from './safeNext';

/** The safe `?next=` of the current page, or the library. */
export function useReturnPath(): string {
  const { next } = useGlobalSearchParams<{ next?: string }>();
  return safeNext(next);
}
