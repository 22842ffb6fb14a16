// Edits made without signal: kept in a durable queue (a Map here; IndexedDB in the app) with a count of the
// edits waiting, put back into the editor on the next visit (even after a reload without signal), sent through
// the normal save from the version they were made on once the connection returns, and a 409 then offers the
// usual choices.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { AUTOSAVE_DELAY_MS, createPersist, saveStatusLabel, type DurableQueue, type PersistClient, type QueuedChanges, type SaveBody } from '../../../canvas/editor/persist';
import { demoSetups } from '../../../db/seed-setups';

const doc = demoSetups[0]!.document;
const setup = { id: 's1', version: 4, studioId: 'st1', title: 'Basement portraits', notes: '', document: doc };
const keyX = (d: { items: { id: string }[] }) => (d.items.find((i) => i.id === 'key') as unknown as { x: number }).x;
const nudge = (e: Editor) => {
  e.dispatch('select', { ids: ['key'] });
  e.dispatch('nudge', { dx: 0.1, dy: 0 });
};

function memoryQueue(): DurableQueue & { m: Map<string, QueuedChanges> } {
  const m = new Map<string, QueuedChanges>();
  return {
    m,
    load: async (id) => structuredClone(m.get(id) ?? null),
    put: async (e) => void m.set(e.setupId, structuredClone(e)),
    remove: async (id) => void m.delete(id),
  };
}

/** A client whose network is cut while `net.up` is false. */
function client(net: { up: boolean }, opts: { conflict?: unknown; serverVersion?: number } = {}) {
  const calls: SaveBody[] = [];
  let version = opts.serverVersion ?? setup.version;
  const c: PersistClient = {
    save: async (_id, body) => {
      if (!net.up) throw new TypeError('Failed to fetch');
      calls.push(body);
      if (opts.conflict && body.version !== version) throw Object.assign(new Error('HTTP 409'), { status: 409, body: { error: { current: opts.conflict } } });
      return { version: ++version };
    },
    createCopy: async () => ({ id: 'copy' }),
  };
  return { c, calls };
}

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('offline queue', () => {
  it('counts each edit made offline and keeps them durably from the version they were made on', async () => {
    const net = { up: false };
    const q = memoryQueue();
    const e = createEditor(doc);
    const { c } = client(net);
    const p = createPersist(e, { setup, client: c, queue: q, isOnline: () => net.up });
    nudge(e);
    nudge(e);
    e.dispatch('setMeta', { title: 'Basement portraits, lower key' });
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(p.getState().waiting).toBe(3);
    expect(p.getState().status.kind).toBe('offline');
    expect(saveStatusLabel(p.getState().status, p.getState().waiting)).toBe('Offline — 3 changes waiting');
    const kept = q.m.get('s1')!;
    expect(kept.baseVersion).toBe(4);
    expect(kept.count).toBe(3);
    expect(keyX(kept.changes.document!)).toBeCloseTo(keyX(doc) + 0.2);
    expect(kept.changes.title).toBe('Basement portraits, lower key');
    p.dispose();
  });

  it('after a reload without signal puts the queued edits back, then sends them on reconnect and clears the queue', async () => {
    const net = { up: false };
    const q = memoryQueue();
    const first = createEditor(doc);
    const p1 = createPersist(first, { setup, client: client(net).c, queue: q, isOnline: () => net.up });
    nudge(first);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    p1.dispose(); // the page reloads

    const again = createEditor(doc); // the cached copy from before the edit
    const { c, calls } = client(net);
    const p2 = createPersist(again, { setup, client: c, queue: q, isOnline: () => net.up });
    await p2.restored;
    expect(keyX(again.getState().doc)).toBeCloseTo(keyX(doc) + 0.1);
    expect(p2.getState().waiting).toBe(1);
    expect(p2.getState().status.kind).toBe('offline');
    net.up = true;
    p2.resume();
    await vi.advanceTimersByTimeAsync(10);
    expect(calls).toHaveLength(1);
    expect(calls[0]!.version).toBe(4);
    expect(keyX(calls[0]!.document!)).toBeCloseTo(keyX(doc) + 0.1);
    expect(p2.getState().waiting).toBe(0);
    expect(p2.getState().status.kind).toBe('saved');
    expect(q.m.has('s1')).toBe(false);
    p2.dispose();
  });

  it('a queued edit that crossed someone else’s save offers the usual choices', async () => {
    const q = memoryQueue();
    q.m.set('s1', { setupId: 's1', baseVersion: 4, changes: { title: 'Mine' }, count: 1, at: new Date().toISOString() });
    const theirs = { ...setup, version: 5, title: 'Theirs', updatedAt: new Date().toISOString() };
    const e = createEditor(doc);
    const { c } = client({ up: true }, { conflict: theirs, serverVersion: 5 });
    // The server moved on to version 5 meanwhile.
    const p = createPersist(e, { setup: { ...setup, version: 5, title: 'Theirs' }, client: c, queue: q, isOnline: () => true });
    await p.restored;
    await vi.advanceTimersByTimeAsync(10);
    expect(e.getState().meta.title).toBe('Mine');
    expect(p.getState().status.kind).toBe('conflict');
    p.loadTheirs();
    expect(e.getState().meta.title).toBe('Theirs');
    await vi.advanceTimersByTimeAsync(10);
    expect(q.m.has('s1')).toBe(false);
    p.dispose();
  });

  it('drops a queued entry the server already has', async () => {
    const q = memoryQueue();
    q.m.set('s1', { setupId: 's1', baseVersion: 3, changes: { title: setup.title }, count: 1, at: new Date().toISOString() });
    const e = createEditor(doc);
    const p = createPersist(e, { setup, client: client({ up: true }).c, queue: q, isOnline: () => true });
    await p.restored;
    expect(q.m.has('s1')).toBe(false);
    expect(p.getState().waiting).toBe(0);
    p.dispose();
  });

  it('closing the page without signal keeps the edits in the queue instead of a page-close save', async () => {
    const net = { up: false };
    const q = memoryQueue();
    const e = createEditor(doc);
    const { c, calls } = client(net);
    const p = createPersist(e, { setup, client: c, queue: q, isOnline: () => net.up });
    nudge(e);
    p.saveOnClose();
    expect(calls).toHaveLength(0);
    await vi.advanceTimersByTimeAsync(0);
    expect(q.m.get('s1')?.count).toBe(1);
    p.dispose();
  });
});
