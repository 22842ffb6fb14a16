// Pages rendered at build time (scripts/staticPages.mjs) are hydrated in the browser: React's first pass must
// draw exactly what the build drew, which knew no address, session or window. What depends on them waits one
// render: `useHydrated()` is false while the page renders at build time and while it hydrates, true from the
// render after (React re-renders at once when the two answers differ), and true from the start on a page the
// browser renders itself (the app shell).
import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};
const onClient = () => true;
const atBuild = () => false;

export function useHydrated(): boolean {
  return useSyncExternalStore(subscribe, onClient, atBuild);
}
