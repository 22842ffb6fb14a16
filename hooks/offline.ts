// Working without signal, on the web: the service worker (registered with workbox-window; web/serviceWorker.ts
// decides what it keeps), whether the device is online, "keep offline" for a setup (the page fills the cache
// the worker answers from when the network fails), and sending changes queued without signal once the
// connection is back, for setups no editor has open (an open editor sends its own, see canvas/editor/persist.ts).
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useState, useSyncExternalStore } from 'react';
import { Platform } from 'react-native';
import { flushAll, isOpenInEditor } from '../canvas/editor/persist';
import { ApiRequestError } from './api';
import { keptStore, offlineQueue, onOfflineStoreChange, onQueueOwnerChange, type KeptSetup, type QueuedEntry } from './offlineQueue';
import { persistClient } from './persistClient';
import { setupKeys } from './setups';

/** The cache of setups marked "keep offline" (the worker refreshes and reads it: web/serviceWorker.ts). */
export const KEPT_CACHE = 'falloff-kept';
const OUR_CACHES = [KEPT_CACHE, 'falloff-session', 'falloff-setups', 'falloff-lists', 'falloff-pages'];

const isWeb = Platform.OS === 'web' && typeof window !== 'undefined';

type Wb = { messageSkipWaiting: () => void; addEventListener: (t: 'controlling', fn: () => void) => void; update: () => Promise<unknown> };
let workbox: Wb | null = null;
let updateWaiting = false;
const updateListeners = new Set<() => void>();
/** How often an open page asks whether a new build is out (the browser also asks on every navigation). */
const UPDATE_CHECK_MS = 30 * 60_000;

/** Register the service worker once, in the built app only (the dev server's bundles change under it). A new
 *  build's worker waits (web/serviceWorker.ts does not skip waiting by itself) until the person chooses to
 *  reload: `useUpdateReady` says one is waiting, `applyUpdate` switches to it once nothing is left unsent. */
export function registerServiceWorker() {
  if (!isWeb || process.env.NODE_ENV !== 'production' || !('serviceWorker' in navigator)) return;
  void import('workbox-window')
    .then(({ Workbox }) => {
      const wb = new Workbox('/sw.js');
      wb.addEventListener('waiting', () => {
        updateWaiting = true;
        updateListeners.forEach((fn) => fn());
      });
      // The first worker takes the page after its first answers went past it: ask for the session and the
      // account again through it, so a reload without signal stays signed in even before "Keep offline".
      wb.addEventListener('controlling', (e: { isUpdate?: boolean }) => {
        if (e.isUpdate) return;
        for (const u of ['/api/auth/get-session', '/api/me']) void fetch(u, { credentials: 'same-origin' }).catch(() => {});
      });
      workbox = wb;
      setInterval(() => void wb.update().catch(() => {}), UPDATE_CHECK_MS);
      return wb.register();
    })
    .catch(() => {
      /* no worker (a private window, an old browser): the app works, just not without signal */
    });
}

/** Whether a new version of the app is installed and waiting for a reload. */
export function useUpdateReady(): boolean {
  return useSyncExternalStore(
    (fn) => {
      updateListeners.add(fn);
      return () => updateListeners.delete(fn);
    },
    () => updateWaiting,
    () => false,
  );
}

/** Switch to the waiting version: first save every open editor and send the queued changes; only when none
 *  is left on this device does the new worker take over and the page reload. Returns the number of changes
 *  still waiting (0: reloading). */
export async function applyUpdate(qc: QueryClient): Promise<number> {
  await flushAll();
  await sendQueuedNow(qc);
  const left = (await offlineQueue.all()).reduce((n, e) => n + e.count, 0);
  if (left > 0 || !workbox) return left;
  let reloaded = false;
  workbox.addEventListener('controlling', () => {
    if (reloaded) return;
    reloaded = true;
    window.location.reload();
  });
  workbox.messageSkipWaiting();
  return 0;
}

function subscribeOnline(fn: () => void) {
  if (!isWeb) return () => {};
  window.addEventListener('online', fn);
  window.addEventListener('offline', fn);
  return () => {
    window.removeEventListener('online', fn);
    window.removeEventListener('offline', fn);
  };
}
export const isOnlineNow = () => (isWeb && typeof navigator !== 'undefined' ? navigator.onLine !== false : true);

/** Whether the device says it has a connection. */
export function useOnline(): boolean {
  return useSyncExternalStore(subscribeOnline, isOnlineNow, () => true);
}

/** The queued changes on this device: entries, the edits they hold, and those waiting for a choice. */
export function useOfflineQueue(): { entries: QueuedEntry[]; waiting: number; conflicts: QueuedEntry[] } {
  const [entries, setEntries] = useState<QueuedEntry[]>([]);
  useEffect(() => {
    let live = true;
    const read = () => void offlineQueue.all().then((e) => live && setEntries(e), () => {});
    read();
    const off = onOfflineStoreChange(read);
    return () => {
      live = false;
      off();
    };
  }, []);
  return { entries, waiting: entries.reduce((n, e) => n + e.count, 0), conflicts: entries.filter((e) => e.conflict) };
}

/** How the last send of queued changes went, for the banner: under way, or what stopped it (the queue then keeps
 *  trying on its own, and sooner when the connection comes back or its owner signs in). */
export type SendState = { sending: boolean; failed: string | null };
let sendState: SendState = { sending: false, failed: null };
const sendListeners = new Set<() => void>();
function setSendState(next: Partial<SendState>) {
  sendState = { ...sendState, ...next };
  sendListeners.forEach((fn) => fn());
}
/** Whether queued changes are being sent, and why the last try left some unsent. */
export function useSendState(): SendState {
  return useSyncExternalStore(
    (fn) => {
      sendListeners.add(fn);
      return () => sendListeners.delete(fn);
    },
    () => sendState,
    () => sendState,
  );
}
/** Why a send failed, in words for the banner. */
function whyNotSent(err: unknown): string {
  if (err instanceof ApiRequestError) {
    if (err.status === 401) return 'you are signed out here; sign in again to send them';
    if (err.status === 503) return 'the server is busy or restarting';
    return `the server answered ${err.status}`;
  }
  return 'the server could not be reached';
}

/** Seconds between tries while changes stay unsent: doubling from 5 s to at most a minute. */
export const RETRY_FIRST_MS = 5_000;
export const RETRY_MAX_MS = 60_000;
let retryTimer: ReturnType<typeof setTimeout> | null = null;
let retryDelay = RETRY_FIRST_MS;

/** How long one queued send may take before it counts as failed (and is tried again). */
const SEND_TIMEOUT_MS = 15_000;
let sending: Promise<void> | null = null;
/** Asked again while a send was under way (e.g. the owner became known after it had read an empty queue). */
let sendAgain = false;
/** Send the signed-in person's queued changes of setups no editor has open. A call while a send is under way
 *  joins it, and one more send follows it (it may have read the queue before the call's reason came about).
 *  A 409 leaves the entry marked for a choice (opening the setup offers the usual choices); an answer that says
 *  the setup is gone or no longer theirs drops it; no connection, a 5xx or a lost session (401) keeps it, and
 *  another try is scheduled (5 s, doubling to a minute) for as long as some are left. */
export function sendQueuedNow(qc: QueryClient): Promise<void> {
  if (!isOnlineNow()) return Promise.resolve();
  if (retryTimer) clearTimeout(retryTimer);
  retryTimer = null;
  if (sending) {
    sendAgain = true;
    return sending;
  }
  sending = (async () => {
    let failed: string | null = null;
    setSendState({ sending: true });
    try {
      for (const e of await offlineQueue.all()) {
        if (e.conflict || isOpenInEditor(e.setupId)) continue;
        try {
          // A send that never answers is given up after a while and tried again; the idempotency key makes a
          // retry of a save that did commit return its result, not a 409.
          await persistClient.save(e.setupId, { version: e.baseVersion, ...e.changes }, { signal: AbortSignal.timeout(SEND_TIMEOUT_MS), idempotencyKey: `queued-${e.setupId}-${e.baseVersion}-${Date.parse(e.at) || 0}` });
          await offlineQueue.remove(e.setupId);
          void qc.invalidateQueries({ queryKey: setupKeys.detail(e.setupId) });
          void qc.invalidateQueries({ queryKey: setupKeys.lists() });
        } catch (err) {
          if (err instanceof ApiRequestError && err.status === 409) await offlineQueue.markConflict(e.setupId);
          else if (err instanceof ApiRequestError && err.status < 500 && err.status !== 401) await offlineQueue.remove(e.setupId);
          else failed ??= whyNotSent(err);
        }
      }
    } finally {
      sending = null;
    }
    if (sendAgain) {
      sendAgain = false;
      return sendQueuedNow(qc);
    }
    if (failed && isWeb) {
      const delay = retryDelay;
      retryDelay = Math.min(RETRY_MAX_MS, retryDelay * 2);
      retryTimer = setTimeout(() => void sendQueuedNow(qc), delay);
      setSendState({ sending: false, failed });
    } else {
      retryDelay = RETRY_FIRST_MS;
      setSendState({ sending: false, failed: null });
    }
  })();
  return sending;
}

/** Send queued changes now, whenever the connection comes back, and when their owner signs in on this page. */
export function useQueueSender() {
  const qc = useQueryClient();
  useEffect(() => {
    if (!isWeb) return;
    const send = () => {
      retryDelay = RETRY_FIRST_MS;
      void sendQueuedNow(qc);
    };
    send();
    window.addEventListener('online', send);
    const offOwner = onQueueOwnerChange(send);
    return () => {
      window.removeEventListener('online', send);
      offOwner();
    };
  }, [qc]);
}

/** What "keep offline" stores for a setup: the JSON, the plan image the crew panel shows, the crew sheet on the
 *  account's paper, the frame and the comments. */
export function keptUrls(setupId: string, o: { version: number; paper: string }): { url: string; required: boolean }[] {
  const base = `/api/setups/${encodeURIComponent(setupId)}`;
  return [
    { url: base, required: true },
    { url: `${base}/crew-sheet.pdf?download=1&paper=${o.paper}`, required: true },
    { url: `${base}/plan.png?width=900&v=${o.version}`, required: true },
    { url: `${base}/frame.png?width=1200`, required: false },
    { url: `${base}/comments`, required: false },
    { url: '/api/me', required: false },
    { url: '/api/auth/get-session', required: false },
  ];
}

/** Store a setup for use without signal; throws when its JSON or crew sheet could not be fetched. */
export async function keepOffline(setupId: string, o: { title: string; version: number; paper: string }): Promise<KeptSetup> {
  if (typeof caches === 'undefined') throw new Error('this browser cannot keep files for offline use');
  const cache = await caches.open(KEPT_CACHE);
  const stored: string[] = [];
  for (const { url, required } of keptUrls(setupId, o)) {
    const res = await fetch(url, { credentials: 'same-origin' }).catch(() => null);
    if (res?.ok) {
      await cache.put(url, res);
      stored.push(url);
    } else if (required) {
      throw new Error(res ? `the server answered ${res.status} for ${url.split('?')[0]!.split('/').pop()}` : 'no connection');
    }
  }
  const kept: KeptSetup = { setupId, title: o.title, at: new Date().toISOString(), urls: stored };
  await keptStore.put(kept);
  return kept;
}

export async function dropOffline(setupId: string): Promise<void> {
  const kept = await keptStore.get(setupId);
  if (kept && typeof caches !== 'undefined') {
    const cache = await caches.open(KEPT_CACHE);
    // The session and account stay: other kept setups need them.
    await Promise.all(kept.urls.filter((u) => u.startsWith('/api/setups/')).map((u) => cache.delete(u)));
  }
  await keptStore.remove(setupId);
}

/** One setup's "keep offline" state, with ways to change it. */
export function useKeptSetup(setupId: string) {
  const [kept, setKept] = useState<KeptSetup | null | undefined>(undefined);
  const read = useCallback(() => void keptStore.get(setupId).then(setKept, () => setKept(null)), [setupId]);
  useEffect(() => {
    read();
    return onOfflineStoreChange(read);
  }, [read]);
  return kept;
}

/** Forget everything kept on this device for the signed-in person (signing out). */
export async function clearOfflineData(): Promise<void> {
  if (!isWeb) return;
  if (typeof caches !== 'undefined') await Promise.all(OUR_CACHES.map((c) => caches.delete(c)));
  // Changes still queued stay, under their owner: sent when this person signs in again, never by anyone else.
  await keptStore.clear().catch(() => {});
}
