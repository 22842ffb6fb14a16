// The device's own store for working without signal (IndexedDB through idb): changes the editor could not send
// (one entry per setup, merged, with the number of edits it holds) and the setups marked "keep offline". Every
// change to either is announced to listeners in this page, so the banners and counts follow.
// Queued changes belong to the person who made them: each entry is stored under its owner's user id, and only
// the signed-in person's entries are read, counted, sent or removed. Signing out leaves them on the device;
// another person signing in on it never sends or drops them, and they go out when their owner signs in again.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { DurableQueue, QueuedChanges } from '../canvas/editor/persist';

export type KeptSetup = { setupId: string; title: string; at: string; urls: string[] };
/** A queued entry the server refused with a 409 while no editor had it open: the user chooses in the editor. */
export type QueuedEntry = QueuedChanges & { conflict?: boolean };
/** As stored: with the user id of the person who made the changes ('' for entries from before owners). */
type StoredEntry = QueuedEntry & { owner: string };

interface OfflineDb extends DBSchema {
  queue: { key: [string, string]; value: StoredEntry };
  kept: { key: string; value: KeptSetup };
}

// Who is signed in (hooks/auth.ts says so as the session is known): undefined until known, null signed out.
let owner: string | null | undefined = undefined;
let ownerWaiters: ((id: string) => void)[] = [];
const ownerListeners = new Set<() => void>();
/** Say who is signed in on this page (null: nobody). The queue then reads and writes that person's entries. */
export function setQueueOwner(id: string | null): void {
  if (id === owner) return;
  owner = id;
  if (id) {
    const waiting = ownerWaiters;
    ownerWaiters = [];
    waiting.forEach((w) => w(id));
  }
  ownerListeners.forEach((fn) => fn());
  changed();
}
/** Be told when the signed-in person changes (their queued changes may now be sent). */
export function onQueueOwnerChange(fn: () => void): () => void {
  ownerListeners.add(fn);
  return () => ownerListeners.delete(fn);
}
/** The signed-in person, waiting until the session is known (an editor may mount before it is). */
const ownerNow = (): Promise<string> => (owner ? Promise.resolve(owner) : new Promise((resolve) => ownerWaiters.push(resolve)));
const strip = ({ owner: _o, ...e }: StoredEntry): QueuedEntry => e;
const mine = (e: StoredEntry) => !!owner && (e.owner === owner || e.owner === '');

let dbPromise: Promise<IDBPDatabase<OfflineDb>> | null = null;
const available = () => typeof indexedDB !== 'undefined';

function db() {
  dbPromise ??= openDB<OfflineDb>('falloff-offline', 2, {
    async upgrade(d, oldVersion, _newVersion, tx) {
      // Version 1 kept one entry per setup with no owner: carried over as '' (sent by whoever signs in first,
      // as before; the server refuses anyone without access to the setup).
      let old: QueuedEntry[] = [];
      if (oldVersion >= 1) {
        old = (await tx.objectStore('queue' as never).getAll()) as QueuedEntry[];
        d.deleteObjectStore('queue');
      }
      const queue = d.createObjectStore('queue', { keyPath: ['owner', 'setupId'] });
      for (const e of old) await queue.put({ ...e, owner: '' });
      if (oldVersion < 1) d.createObjectStore('kept', { keyPath: 'setupId' });
    },
  });
  return dbPromise;
}

const listeners = new Set<() => void>();
/** Be told when the queue or the kept list changes; returns how to stop. */
export function onOfflineStoreChange(fn: () => void): () => void {
  listeners.add(fn);
  return () => listeners.delete(fn);
}
const changed = () => listeners.forEach((fn) => fn());

export const offlineQueue: DurableQueue & { all: () => Promise<QueuedEntry[]>; markConflict: (id: string) => Promise<void> } = {
  load: async (id) => {
    if (!available()) return null;
    const who = await ownerNow();
    const d = await db();
    const e = (await d.get('queue', [who, id])) ?? (await d.get('queue', ['', id]));
    return e ? strip(e) : null;
  },
  put: async (entry) => {
    if (!available()) return;
    const who = await ownerNow();
    const d = await db();
    await d.put('queue', { ...entry, owner: who });
    await d.delete('queue', ['', entry.setupId]);
    changed();
  },
  remove: async (id) => {
    if (!available() || !owner) return;
    const d = await db();
    await d.delete('queue', [owner, id]);
    await d.delete('queue', ['', id]);
    changed();
  },
  /** The signed-in person's entries (none while nobody is known to be signed in). */
  all: async () => (available() && owner ? (await (await db()).getAll('queue')).filter(mine).map(strip) : []),
  markConflict: async (id) => {
    if (!owner) return;
    const d = await db();
    const e = (await d.get('queue', [owner, id])) ?? (await d.get('queue', ['', id]));
    if (e) await d.put('queue', { ...e, conflict: true });
    changed();
  },
};

export const keptStore = {
  all: async (): Promise<KeptSetup[]> => (available() ? (await db()).getAll('kept') : []),
  get: async (id: string) => (available() ? ((await (await db()).get('kept', id)) ?? null) : null),
  put: async (k: KeptSetup) => {
    await (await db()).put('kept', k);
    changed();
  },
  remove: async (id: string) => {
    await (await db()).delete('kept', id);
    changed();
  },
  clear: async () => {
    if (!available()) return;
    await (await db()).clear('kept');
    changed();
  },
};
