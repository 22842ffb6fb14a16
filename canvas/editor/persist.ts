// Autosave, from the editor's store and outside React. It watches the document, the title and the notes;
// owns the version the next save starts from, what is not saved yet, the debounce, the back-off while the
// server cannot be reached, and the conflict when someone else saved first (load theirs, or keep mine as a
// copy). A gesture's end saves at once rather than after the debounce. The page-close save goes through the
// same client; what it sends is kept in storage until it is known to have landed, so a failure there is
// shown on return (never silently lost). Without signal, what is not saved goes into a durable queue (an
// IndexedDB store on the web, `queue` below) after every change, with a count of the edits waiting; reopening
// the setup (even after a reload without signal) puts them back into the editor and saves them through the
// same path once the connection returns, where a 409 offers the usual choices.
import { createStore, type StoreApi } from 'zustand';
import type { SetupDetail, SetupSaved } from '../../model/api';
import type { SetupDocument } from '../../model/document';
import type { Editor } from './editor';

type Changes = { document?: SetupDocument; title?: string; notes?: string };
export type SaveBody = Changes & { version: number };

export type SaveStatus =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'offline'; retryInMs: number }
  | { kind: 'conflict'; theirs: SetupDetail }
  | { kind: 'failed'; message: string };

/** Changes sent as the page closed whose arrival was never confirmed. */
type KeptChanges = { setupId: string; baseVersion: number; changes: Changes; at: string };

/** `waiting`: edits made since the last confirmed save while the server could not be reached (0 otherwise). */
type PersistState = { status: SaveStatus; kept: KeptChanges | null; waiting: number };

/** Changes made without signal, kept durably until a save confirms them. `count`: the edits they hold. */
export type QueuedChanges = { setupId: string; baseVersion: number; changes: Changes; count: number; at: string };

/** Where queued changes live (hooks/offlineQueue.ts: IndexedDB). */
export type DurableQueue = {
  load: (setupId: string) => Promise<QueuedChanges | null>;
  put: (entry: QueuedChanges) => Promise<void>;
  remove: (setupId: string) => Promise<void>;
};

/** The API client's part persist needs. Errors carry the HTTP `status` (none: the network failed) and the
 *  server's JSON `body` (a 409's body names the stored copy: `body.error.current`). */
export type PersistClient = {
  /** `idempotencyKey`: the same for a retry of the same save, so a save that committed but whose answer was lost
   *  is answered again by the server instead of a version conflict. */
  save: (id: string, body: SaveBody, opts?: { keepalive?: boolean; idempotencyKey?: string; signal?: AbortSignal }) => Promise<Pick<SetupSaved, 'version'> & Partial<SetupSaved>>;
  createCopy: (body: { studioId?: string; title: string; document: SetupDocument; notes: string }) => Promise<{ id: string }>;
};

type KeyValueStorage = { getItem(k: string): string | null; setItem(k: string, v: string): void; removeItem(k: string): void };

export type PersistOptions = {
  setup: Pick<SetupDetail, 'id' | 'version' | 'studioId' | 'title' | 'notes' | 'document'>;
  client: PersistClient;
  storage?: KeyValueStorage | null;
  delayMs?: number;
  /** Told about each save as it is sent (the screen updates its cached copy at once) and when it lands. */
  onSending?: (changes: Changes) => void;
  onSaved?: (saved: Partial<SetupSaved> & { version: number }) => void;
  /** Told when the editor's copy was replaced by the server's (load theirs). */
  onReplaced?: (theirs: SetupDetail) => void;
  /** Durable place for changes made without signal; none: they live in memory (and the page-close save). */
  queue?: DurableQueue | null;
  /** Whether the device says it has a connection (navigator.onLine on the web). */
  isOnline?: () => boolean;
};

export type Persist = StoreApi<PersistState> & {
  setupId: string;
  /** Save what is pending now (no debounce). */
  flush: () => Promise<void>;
  /** The page is closing: send what is pending with keepalive, keeping a copy until it is confirmed. */
  saveOnClose: () => void;
  /** The connection came back: retry at once. */
  resume: () => void;
  loadTheirs: () => void;
  keepMineAsCopy: () => Promise<{ id: string }>;
  /** Put changes kept from a failed page-close save back into the editor (and save them). */
  restoreKept: () => void;
  discardKept: () => void;
  hasPending: () => boolean;
  /** Resolves once changes queued without signal on an earlier visit are back in the editor (or there were none). */
  restored: Promise<void>;
  dispose: () => void;
};

export const AUTOSAVE_DELAY_MS = 700;
export const BACKOFF_FIRST_MS = 2000;
const BACKOFF_MAX_MS = 30_000;
export const keptKey = (id: string) => `falloff:unsaved:${id}`;

/** Every live persist, so an error boundary can save before it shows its message. */
const live = new Set<Persist>();
export async function flushAll(): Promise<void> {
  await Promise.all([...live].map((p) => p.flush().catch(() => {})));
}

const statusOf = (e: unknown) => (typeof (e as { status?: unknown })?.status === 'number' ? (e as { status: number }).status : null);
const theirsOf = (e: unknown) => ((e as { body?: { error?: { current?: SetupDetail } } })?.body?.error?.current ?? null);
const messageOf = (e: unknown) => (e instanceof Error ? e.message : String(e));
const isEmpty = (c: Changes) => c.document === undefined && c.title === undefined && c.notes === undefined;

export function createPersist(editor: Editor, o: PersistOptions): Persist {
  const id = o.setup.id;
  const delay = o.delayMs ?? AUTOSAVE_DELAY_MS;
  const storage = o.storage ?? null;
  const store = createStore<PersistState>(() => ({ status: { kind: 'saved', at: null }, kept: null, waiting: 0 }));
  const durable = o.queue ?? null;
  const online = o.isOnline ?? (() => true);
  const set = (status: SaveStatus) => store.setState({ status });
  let version = o.setup.version;
  let pending: Changes = {};
  let inFlight: Promise<void> | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let backoff = 0;
  /** The key and changes of a save that failed without an answer: its retry reuses the key while nothing newer
   *  joined it (with newer changes it is another save, with a key of its own). */
  let unanswered: { key: string; version: number; fields: Changes } | null = null;
  let replacing = false;
  let disposed = false;

  // Changes kept from a page-close save that was never confirmed: shown unless the server has them.
  if (storage) {
    const raw = storage.getItem(keptKey(id));
    if (raw) {
      try {
        const kept = JSON.parse(raw) as KeptChanges;
        const landed =
          o.setup.version > kept.baseVersion &&
          (kept.changes.document === undefined || JSON.stringify(kept.changes.document) === JSON.stringify(o.setup.document)) &&
          (kept.changes.title === undefined || kept.changes.title === o.setup.title) &&
          (kept.changes.notes === undefined || kept.changes.notes === o.setup.notes);
        if (landed) storage.removeItem(keptKey(id));
        else store.setState({ kept });
      } catch {
        storage.removeItem(keptKey(id));
      }
    }
  }

  const clearTimer = () => {
    if (timer) clearTimeout(timer);
    timer = null;
  };
  const schedule = (ms = delay) => {
    clearTimer();
    timer = setTimeout(() => {
      timer = null;
      void flush();
    }, ms);
  };

  /** The version the unconfirmed changes start from: kept with them in the durable queue. */
  let waitingSince = version;
  const writeQueue = () => {
    if (!durable || isEmpty(pending)) return;
    const entry: QueuedChanges = { setupId: id, baseVersion: waitingSince, changes: pending, count: Math.max(1, store.getState().waiting), at: new Date().toISOString() };
    durable.put(entry).catch(() => {});
  };
  const isOffline = () => store.getState().status.kind === 'offline' || !online();

  const queue = (c: Changes) => {
    pending = { ...pending, ...c };
    // One edit: a change outside a gesture, or a whole gesture (counted as it ends, below).
    if (isOffline() && !editor.getState().gesture) {
      if (!store.getState().waiting) waitingSince = version;
      store.setState({ waiting: store.getState().waiting + 1 });
      writeQueue();
    }
    const k = store.getState().status.kind;
    if (k === 'conflict' || k === 'offline') return; // the conflict waits for a choice; back-off keeps its timer
    if (k !== 'pending' && !inFlight) set({ kind: 'pending' });
    if (!editor.getState().gesture) schedule();
  };

  async function run(): Promise<void> {
    const fields = pending;
    pending = {};
    set({ kind: 'saving' });
    o.onSending?.(fields);
    const key = unanswered && unanswered.version === version && sameChanges(unanswered.fields, fields) ? unanswered.key : newSaveKey();
    unanswered = null;
    try {
      const saved = await o.client.save(id, { version, ...fields }, { idempotencyKey: key });
      version = saved.version;
      backoff = 0;
      if (store.getState().waiting || durable) {
        store.setState({ waiting: 0 });
        if (isEmpty(pending)) durable?.remove(id).catch(() => {});
        else writeQueue();
      }
      o.onSaved?.(saved);
      set(isEmpty(pending) ? { kind: 'saved', at: new Date() } : { kind: 'pending' });
    } catch (e) {
      const status = statusOf(e);
      if (status === 409) {
        // Keep what was not saved: "keep mine as a copy" still has it.
        pending = { ...fields, ...pending };
        const theirs = theirsOf(e);
        set(theirs ? { kind: 'conflict', theirs } : { kind: 'failed', message: messageOf(e) });
      } else if (status !== null && status < 500) {
        set({ kind: 'failed', message: messageOf(e) });
      } else {
        unanswered = { key, version, fields };
        pending = { ...fields, ...pending };
        // The edits this save held are now waiting for the connection: keep them durably.
        if (!store.getState().waiting) {
          waitingSince = version;
          store.setState({ waiting: 1 });
        }
        writeQueue();
        backoff = Math.min(BACKOFF_MAX_MS, backoff ? backoff * 2 : BACKOFF_FIRST_MS);
        set({ kind: 'offline', retryInMs: backoff });
        // A closed editor's queued changes are sent by the page's queue (hooks/offline.ts), not by a timer here.
        if (!disposed) schedule(backoff);
      }
    }
  }

  async function flush(): Promise<void> {
    if (inFlight) {
      await inFlight;
      if (isEmpty(pending) || store.getState().status.kind !== 'pending') return;
    }
    if (isEmpty(pending) || store.getState().status.kind === 'conflict') return;
    clearTimer();
    inFlight = run().finally(() => {
      inFlight = null;
    });
    await inFlight;
    if (!disposed && !isEmpty(pending) && store.getState().status.kind === 'pending') schedule();
  }

  const unsubscribe = editor.subscribe((s, prev) => {
    if (replacing || s.readOnly) return;
    const c: Changes = {};
    if (s.doc !== prev.doc) c.document = s.doc;
    if (s.meta.title !== prev.meta.title) c.title = s.meta.title;
    if (s.meta.notes !== prev.meta.notes) c.notes = s.meta.notes;
    if (!isEmpty(c)) queue(c);
    if (prev.gesture && !s.gesture && !isEmpty(pending) && isOffline()) {
      if (!store.getState().waiting) waitingSince = version;
      store.setState({ waiting: store.getState().waiting + 1 });
      writeQueue();
    }
    // A gesture ended: save now, not after the debounce — in a task of its own, so the request (the
    // document's JSON, the status shown) does not lengthen the frame that paints where the hand let go.
    if (prev.gesture && !s.gesture && !isEmpty(pending) && store.getState().status.kind === 'pending') schedule(0);
  });

  const persist: Persist = Object.assign(store, {
    setupId: id,
    flush,
    hasPending: () => !isEmpty(pending) || !!inFlight,
    restored: Promise.resolve(),
    saveOnClose: () => {
      if (isEmpty(pending) || store.getState().status.kind === 'conflict') return;
      // Without signal the changes are in the durable queue already: a page-close save could only fail.
      if (durable && isOffline()) {
        if (!store.getState().waiting) {
          waitingSince = version;
          store.setState({ waiting: 1 });
        }
        writeQueue();
        return;
      }
      clearTimer();
      const changes = pending;
      const kept: KeptChanges = { setupId: id, baseVersion: version, changes, at: new Date().toISOString() };
      storage?.setItem(keptKey(id), JSON.stringify(kept));
      pending = {};
      void o.client.save(id, { version, ...changes }, { keepalive: true }).then(
        (saved) => {
          version = saved.version;
          storage?.removeItem(keptKey(id));
          set({ kind: 'saved', at: new Date() });
        },
        (e) => {
          // Still here (the page did not close after all): put the changes back and say so.
          pending = { ...changes, ...pending };
          set({ kind: 'failed', message: messageOf(e) });
        },
      );
    },
    resume: () => {
      if (store.getState().status.kind !== 'offline') return;
      clearTimer();
      set({ kind: 'pending' });
      void flush();
    },
    loadTheirs: () => {
      const st = store.getState().status;
      if (st.kind !== 'conflict') return;
      const theirs = st.theirs;
      clearTimer();
      pending = {};
      version = theirs.version;
      store.setState({ waiting: 0 });
      durable?.remove(id).catch(() => {});
      replacing = true;
      try {
        editor.load(theirs.document as SetupDocument, { title: theirs.title, notes: theirs.notes });
      } finally {
        replacing = false;
      }
      o.onReplaced?.(theirs);
      set({ kind: 'saved', at: new Date() });
    },
    keepMineAsCopy: async () => {
      const s = editor.getState();
      const copy = await o.client.createCopy({ studioId: o.setup.studioId ?? undefined, title: `${s.meta.title} (my version)`, document: s.doc, notes: s.meta.notes });
      pending = {};
      store.setState({ waiting: 0 });
      durable?.remove(id).catch(() => {});
      return copy;
    },
    restoreKept: () => {
      const kept = store.getState().kept;
      if (!kept) return;
      const s = editor.getState();
      editor.load(kept.changes.document ?? s.doc, { title: kept.changes.title ?? s.meta.title, notes: kept.changes.notes ?? s.meta.notes });
      storage?.removeItem(keptKey(id));
      store.setState({ kept: null });
      pending = { ...pending, ...kept.changes };
      set({ kind: 'pending' });
      void flush();
    },
    discardKept: () => {
      storage?.removeItem(keptKey(id));
      store.setState({ kept: null });
    },
    dispose: () => {
      if (disposed) return;
      // Leaving the editor saves what is pending (the request outlives the screen).
      if (!isEmpty(pending) && store.getState().status.kind !== 'conflict') void flush();
      disposed = true;
      clearTimer();
      unsubscribe();
      live.delete(persist);
    },
  });
  // Changes queued without signal on an earlier visit: put them back into the editor and save them from the
  // version they were made on (a 409 then offers the usual choices), unless the server has them already.
  if (durable && !editor.getState().readOnly) {
    persist.restored = durable
      .load(id)
      .then((entry) => {
        if (!entry || disposed) return;
        const c = entry.changes;
        const landed =
          o.setup.version > entry.baseVersion &&
          (c.document === undefined || JSON.stringify(c.document) === JSON.stringify(o.setup.document)) &&
          (c.title === undefined || c.title === o.setup.title) &&
          (c.notes === undefined || c.notes === o.setup.notes);
        if (landed) return void durable.remove(id).catch(() => {});
        const s = editor.getState();
        replacing = true;
        try {
          editor.load(c.document ?? s.doc, { title: c.title ?? s.meta.title, notes: c.notes ?? s.meta.notes });
        } finally {
          replacing = false;
        }
        version = entry.baseVersion;
        waitingSince = entry.baseVersion;
        pending = { ...c, ...pending };
        store.setState({ waiting: entry.count });
        if (online()) {
          set({ kind: 'pending' });
          void flush();
        } else {
          set({ kind: 'offline', retryInMs: BACKOFF_FIRST_MS });
          schedule(BACKOFF_FIRST_MS);
        }
      })
      .catch(() => {});
  }
  live.add(persist);
  return persist;
}

/** The persists of the editors on the page now: attached by the mounted editor (attachToPage), not merely made.
 *  A render React throws away (Suspense, a concurrent render) can make a persist that is never mounted nor
 *  disposed; counting it kept that setup's queued changes from ever being sent by the library. */
const attached = new Set<Persist>();

/** Whether a setup is open in an editor on this page (its queued changes are that editor's to send). */
export function isOpenInEditor(setupId: string): boolean {
  return [...attached].some((p) => p.setupId === setupId);
}

/** Hook the page's lifecycle to a persist: save on close (pagehide, or the tab hidden), retry when online. */
export function attachToPage(p: Persist, target: Pick<Window, 'addEventListener' | 'removeEventListener'> & { document?: { visibilityState?: string } } = window): () => void {
  const onHide = () => p.saveOnClose();
  const onVisibility = () => {
    if (target.document?.visibilityState === 'hidden') p.saveOnClose();
  };
  const onOnline = () => p.resume();
  target.addEventListener('pagehide', onHide);
  target.addEventListener('visibilitychange', onVisibility);
  target.addEventListener('online', onOnline);
  attached.add(p);
  return () => {
    attached.delete(p);
    target.removeEventListener('pagehide', onHide);
    target.removeEventListener('visibilitychange', onVisibility);
    target.removeEventListener('online', onOnline);
  };
}

/** The save state in words; `waiting`: edits kept on the device for want of a connection. */
export function saveStatusLabel(s: SaveStatus, waiting = 0): string {
  if (waiting > 0 && (s.kind === 'offline' || s.kind === 'pending' || s.kind === 'saving')) {
    const n = `${waiting} change${waiting === 1 ? '' : 's'}`;
    return s.kind === 'offline' ? `Offline — ${n} waiting` : s.kind === 'saving' ? `Sending ${n}…` : `${n} waiting`;
  }
  switch (s.kind) {
    case 'saved':
      return s.at ? 'Saved' : 'Up to date';
    case 'pending':
      return 'Unsaved changes';
    case 'saving':
      return 'Saving…';
    case 'offline':
      return `Offline — will retry in ${Math.round(s.retryInMs / 1000)} s`;
    case 'conflict':
      return 'Changed elsewhere';
    case 'failed':
      return `Not saved: ${s.message}`;
  }
}

/** A fresh idempotency key for one save. */
function newSaveKey(): string {
  return `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 12)}`;
}

/** The same changes: the same fields holding the same values (documents compared by identity). */
function sameChanges(a: Changes, b: Changes): boolean {
  const ka = Object.keys(a) as (keyof Changes)[];
  return ka.length === Object.keys(b).length && ka.every((k) => a[k] === b[k]);
}
