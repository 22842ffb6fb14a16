// The service worker (built by scripts/buildServiceWorker.mjs with Workbox at web build time). What it keeps:
// - the app shell, JS chunks, workers and fonts, precached with a revision per file (the list is written into
//   this file at build time, so a new build is a new worker that replaces the old files and deletes them);
// - pages: always from the network when there is one (so a new build's index.html, naming the new chunks, is
//   never hidden behind an old copy), else the precached app shell;
// - the signed-in state (better-auth's session and /api/me), network first, so a reload without signal stays
//   signed in;
// - setups a person opened (their JSON and the images the screens showed), network first, a bounded number;
// - setups marked "keep offline": the page fills the cache `falloff-kept` itself (hooks/offline.ts); answers
//   for those URLs refresh it while online, and any cached copy answers when the network fails.
// Writes (PUT, POST…) are never cached or replayed here: the editor's queue (hooks/offlineQueue.ts) owns them.
import { clientsClaim } from 'workbox-core';
import { ExpirationPlugin } from 'workbox-expiration';
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute } from 'workbox-precaching';
import { registerRoute } from 'workbox-routing';
import { NetworkFirst } from 'workbox-strategies';
import type { WorkboxPlugin } from 'workbox-core/types';

declare const self: {
  __WB_MANIFEST: { url: string; revision: string | null }[];
  skipWaiting(): Promise<void>;
  addEventListener(type: 'message', fn: (e: { data?: { type?: string } }) => void): void;
};

export const KEPT_CACHE = 'falloff-kept';

// A new build's worker waits until the page asks it to take over ("A new version is ready — Reload", sent by
// workbox-window's messageSkipWaiting once the page has nothing left unsent: hooks/offline.ts). The first
// worker on a device has nobody to wait for and takes the open page at once.
self.addEventListener('message', (e) => {
  if (e.data?.type === 'SKIP_WAITING') void self.skipWaiting();
});
clientsClaim();
cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);

/** When the network fails: the exact URL from any cache, else the same path with another query (the crew
 *  sheet for another paper size beats nothing on set). */
const anyCachedCopy: WorkboxPlugin = {
  handlerDidError: async ({ request }) => (await caches.match(request)) ?? (await caches.match(request, { ignoreSearch: true })) ?? undefined,
};

/** A fresh answer for a kept URL replaces the kept copy too. */
const refreshKept: WorkboxPlugin = {
  fetchDidSucceed: async ({ request, response }) => {
    if (response.ok) {
      const kept = await caches.open(KEPT_CACHE);
      if (await kept.match(request)) await kept.put(request, response.clone());
    }
    return response;
  },
};

const shell = createHandlerBoundToURL('/index.html');
const pages = new NetworkFirst({ cacheName: 'falloff-pages', plugins: [new ExpirationPlugin({ maxEntries: 30 })] });
registerRoute(
  ({ request, url }) => request.mode === 'navigate' && !url.pathname.startsWith('/api/') && !url.pathname.startsWith('/dev/'),
  async (options) => {
    try {
      return await pages.handle(options);
    } catch {
      return shell(options);
    }
  },
);

// Who is signed in: better-auth's session and the account.
registerRoute(
  ({ url, request }) => request.method === 'GET' && (url.pathname === '/api/auth/get-session' || url.pathname === '/api/me'),
  new NetworkFirst({ cacheName: 'falloff-session', plugins: [anyCachedCopy] }),
);

// The library's lists (the last one seen opens without signal).
registerRoute(
  ({ url, request }) => request.method === 'GET' && (url.pathname === '/api/setups' || url.pathname === '/api/tags' || url.pathname === '/api/studios'),
  new NetworkFirst({ cacheName: 'falloff-lists', plugins: [new ExpirationPlugin({ maxEntries: 40 })] }),
);

// One setup and what its screens fetch: the JSON, comments, the plan image, crew sheet and frame.
registerRoute(
  ({ url, request }) => request.method === 'GET' && /^\/api\/setups\/[^/]+(\/(comments|plan\.png|plan\.svg|crew-sheet\.pdf|frame\.png))?$/.test(url.pathname),
  new NetworkFirst({ cacheName: 'falloff-setups', plugins: [new ExpirationPlugin({ maxEntries: 120 }), refreshKept, anyCachedCopy] }),
);
