// expo-router's in-memory router for the web flavour: a tiny screen per route, rendered by ExpoRoot into the
// jsdom document with @testing-library/react. (expo-router's own test helper renders through the native
// testing library, so it cannot be used here.) The page's address starts at `initialUrl`, as a browser's
// would, and the result can read the router's state.
import { render } from '@testing-library/react';
import { createRequire } from 'node:module';
import type { ComponentType } from 'react';

// Through Node's require, so that these are the same modules (one router store) that expo-router's own
// code uses; rn-require.ts resolves them for the web.
const requireHere = createRequire(import.meta.url);
const { ExpoRoot } = requireHere('expo-router/build/ExpoRoot') as typeof import('expo-router/build/ExpoRoot');
const { getMockContext } = requireHere('expo-router/build/testing-library/mock-config') as typeof import('expo-router/build/testing-library/mock-config');
const { store } = requireHere('expo-router/build/global-state/router-store') as typeof import('expo-router/build/global-state/router-store');

export function renderRouter(routes: Record<string, ComponentType>, { initialUrl = '/' }: { initialUrl?: string } = {}) {
  // Routes load synchronously (no lazy chunks in a test), as expo-router's own test helper sets.
  process.env.EXPO_ROUTER_IMPORT_MODE = 'sync';
  window.history.replaceState(null, '', initialUrl);
  const context = getMockContext(routes as never);
  const result = render(<ExpoRoot context={context} location={new URL(initialUrl, window.location.origin)} />);
  return Object.assign(result, {
    getPathname: () => store.getRouteInfo().pathname,
    getPathnameWithParams: () => store.getRouteInfo().pathnameWithParams,
    getSearchParams: () => store.getRouteInfo().params,
  });
}
