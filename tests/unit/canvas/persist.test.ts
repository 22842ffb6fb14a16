// Autosave, headless: a real editor, a scripted API client (each save answered as the test says) and fake
// timers. Debounce coalescing, the save at a gesture's end, offline back-off and resume, a 409 with both
// choices, and a save failing as the page closes (kept, and shown on return).
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { AUTOSAVE_DELAY_MS, BACKOFF_FIRST_MS, attachToPage, createPersist, flushAll, isOpenInEditor, keptKey, type PersistClient, type SaveBody } from '../../../canvas/editor/persist';
import { demoSetups } from '../../../db/seed-setups';
import type { SetupDetail } from '../../../model/api';

const doc = demoSetups[0]!.document;
const setup = { id: 's1', version: 1, studioId: 'st1', title: 'Twin rims', notes: '', document: doc };

type Answer = { ok: true } | { status: number; body?: unknown } | { network: true };
function client(answers: Answer[] = []) {
  const calls: { body: SaveBody; keepalive?: boolean; key?: string }[] = [];
  const copies: unknown[] = [];
  let version = 1;
  const c: PersistClient = {
    save: async (_id, body, opts) => {
      calls.push({ body, keepalive: opts?.keepalive, key: opts?.idempotencyKey });
      const a = answers.shift() ?? { ok: true };
      if ('ok' in a) return { version: ++version };
      if ('network' in a) throw new TypeError('Failed to fetch');
      throw Object.assign(new Error(`HTTP ${a.status}`), { status: a.status, body: a.body ?? null });
    },
    createCopy: async (body) => {
      copies.push(body);
      return { id: 'copy-1' };
    },
  };
  return { c, calls, copies };
}
const memoryStorage = () => {
  const m = new Map<string, string>();
  return { getItem: (k: string) => m.get(k) ?? null, setItem: (k: string, v: string) => void m.set(k, v), removeItem: (k: string) => void m.delete(k), m };
};
const nudge = (e: Editor) => {
  e.dispatch('select', { ids: ['key'] });
  e.dispatch('nudge', { dx: 0.1, dy: 0 });
};
const keyX = (d: { items: { id: string }[] }) => (d.items.find((i) => i.id === "key") as unknown as { x: number }).x;

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('autosave', () => {
  it('coalesces changes within the debounce into one save, from the version it knows', async () => {
    const e = createEditor(doc);
    const { c, calls } = client();
    const p = createPersist(e, { setup, client: c });
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS / 2);
    nudge(e);
    e.dispatch('setMeta', { title: 'Twin rims, tighter' });
    expect(p.getState().status.kind).toBe('pending');
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS / 2);
    expect(calls.length).toBe(0);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(calls.length).toBe(1);
    expect(calls[0]!.body.version).toBe(1);
    expect(keyX(calls[0]!.body.document!)).toBeCloseTo(4.2);
    expect(calls[0]!.body.title).toBe('Twin rims, tighter');
    expect(p.getState().status.kind).toBe('saved');
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(calls[1]!.body.version).toBe(2);
    expect(calls[1]!.body.title).toBeUndefined();
    p.dispose();
  });

  it('saves as soon as a gesture ends, not after the debounce', async () => {
    const e = createEditor(doc);
    e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
    const { c, calls } = client();
    const p = createPersist(e, { setup, client: c });
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'touch' });
    for (let k = 1; k <= 5; k++) e.pointer.move({ screen: { x: 400 + k * 20, y: 410 }, pointer: 'touch' });
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls.length).toBe(0); // the hand is still down
    e.pointer.up({ screen: { x: 500, y: 410 }, pointer: 'touch' });
    // Not in the release's own task (that frame paints where the hand let go), but in the next.
    expect(calls.length).toBe(0);
    await vi.advanceTimersByTimeAsync(0);
    expect(calls.length).toBe(1);
    expect(keyX(calls[0]!.body.document!)).toBeCloseTo(5);
    p.dispose();
  });

  it('retries an unanswered save with its idempotency key, and a save with newer changes with a new one', async () => {
    const e = createEditor(doc);
    const { c, calls } = client([{ network: true }, { network: true }]);
    const p = createPersist(e, { setup, client: c });
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    await vi.advanceTimersByTimeAsync(BACKOFF_FIRST_MS); // the same save again: the server may have committed it
    expect(calls.length).toBe(2);
    expect(calls[0]!.key).toMatch(/\S{6,}/);
    expect(calls[1]!.key).toBe(calls[0]!.key);
    nudge(e); // newer work joins the next retry: that is another save
    await vi.advanceTimersByTimeAsync(BACKOFF_FIRST_MS * 2);
    expect(calls.length).toBe(3);
    expect(calls[2]!.key).not.toBe(calls[0]!.key);
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(new Set(calls.map((x) => x.key)).size).toBe(3); // each answered save had a key of its own
    p.dispose();
  });

  it('backs off while offline, keeps the changes, and resumes', async () => {
    const e = createEditor(doc);
    const { c, calls } = client([{ network: true }, { status: 503 }]);
    const p = createPersist(e, { setup, client: c });
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(p.getState().status).toEqual({ kind: 'offline', retryInMs: BACKOFF_FIRST_MS });
    nudge(e); // more work while offline joins the retry
    await vi.advanceTimersByTimeAsync(BACKOFF_FIRST_MS);
    expect(calls.length).toBe(2);
    expect(p.getState().status).toEqual({ kind: 'offline', retryInMs: BACKOFF_FIRST_MS * 2 });
    // The connection comes back: resume at once rather than wait out the back-off.
    p.resume();
    await vi.advanceTimersByTimeAsync(0);
    expect(calls.length).toBe(3);
    expect(keyX(calls[2]!.body.document!)).toBeCloseTo(4.2);
    expect(calls[2]!.body.version).toBe(1);
    expect(p.getState().status.kind).toBe('saved');
    p.dispose();
  });

  const theirs = (): SetupDetail => ({ ...(setup as unknown as SetupDetail), version: 5, title: 'Twin rims — theirs', notes: 'from the phone', document: doc, updatedAt: new Date().toISOString() });

  it('a 409 shows the conflict and keeps my changes; "load theirs" replaces the plan in one place', async () => {
    const e = createEditor(doc, { title: 'Twin rims' });
    const { c, calls } = client([{ status: 409, body: { error: { code: 'version_conflict', message: 'changed', current: theirs() } } }]);
    const replaced: SetupDetail[] = [];
    const p = createPersist(e, { setup, client: c, onReplaced: (t) => replaced.push(t) });
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(p.getState().status.kind).toBe('conflict');
    nudge(e); // no save goes out while the conflict waits for a choice
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 2);
    expect(calls.length).toBe(1);
    p.loadTheirs();
    expect(e.getState().meta.title).toBe('Twin rims — theirs');
    expect(keyX(e.getState().doc)).toBe(4);
    expect(e.getState().past.length).toBe(0);
    expect(replaced.length).toBe(1);
    expect(p.getState().status.kind).toBe('saved');
    expect(p.hasPending()).toBe(false);
    // The next change saves from their version.
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    expect(calls[1]!.body.version).toBe(5);
    p.dispose();
  });

  it('a 409 then "keep mine as a copy" posts my plan as a new setup', async () => {
    const e = createEditor(doc, { title: 'Twin rims', notes: 'mine' });
    const { c, copies } = client([{ status: 409, body: { error: { current: theirs() } } }]);
    const p = createPersist(e, { setup, client: c });
    nudge(e);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS);
    const copy = await p.keepMineAsCopy();
    expect(copy.id).toBe('copy-1');
    expect(copies[0]).toMatchObject({ studioId: 'st1', title: 'Twin rims (my version)', notes: 'mine' });
    expect(keyX((copies[0] as { document: typeof doc }).document)).toBeCloseTo(4.1);
    expect(p.hasPending()).toBe(false);
    p.dispose();
  });

  it('a save failing as the page closes is kept and shown on return, and can be put back', async () => {
    const storage = memoryStorage();
    const e = createEditor(doc);
    const { c, calls } = client([{ network: true }]);
    const p = createPersist(e, { setup, client: c, storage });
    nudge(e);
    p.saveOnClose();
    expect(calls[0]!.keepalive).toBe(true);
    expect(storage.m.has(keptKey('s1'))).toBe(true);
    await vi.advanceTimersByTimeAsync(0);
    p.dispose();
    // Back again: the server still has version 1 and the old plan.
    const e2 = createEditor(doc);
    const { c: c2, calls: calls2 } = client();
    const p2 = createPersist(e2, { setup, client: c2, storage });
    expect(p2.getState().kept).not.toBeNull();
    expect(keyX(p2.getState().kept!.changes.document!)).toBeCloseTo(4.1);
    p2.restoreKept();
    expect(keyX(e2.getState().doc)).toBeCloseTo(4.1);
    await vi.advanceTimersByTimeAsync(0);
    expect(keyX(calls2[0]!.body.document!)).toBeCloseTo(4.1);
    expect(storage.m.has(keptKey('s1'))).toBe(false);
    p2.dispose();
  });

  it('a page-close save that did land is not shown on return', async () => {
    const storage = memoryStorage();
    const e = createEditor(doc);
    const p = createPersist(e, { setup, client: client().c, storage });
    nudge(e);
    p.saveOnClose();
    // The page went away before the answer came: the copy stays in storage...
    p.dispose();
    const landed = { ...setup, version: 2, document: e.getState().doc };
    storage.setItem(keptKey('s1'), storage.getItem(keptKey('s1')) ?? JSON.stringify({ setupId: 's1', baseVersion: 1, changes: { document: e.getState().doc }, at: '' }));
    // ...but the server has it, so nothing is shown.
    const p2 = createPersist(createEditor(landed.document), { setup: landed, client: client().c, storage });
    expect(p2.getState().kept).toBeNull();
    expect(storage.m.size).toBe(0);
    p2.dispose();
  });

  it('an error boundary can save every open editor before it shows its message', async () => {
    const e = createEditor(doc);
    const { c, calls } = client();
    const p = createPersist(e, { setup, client: c });
    nudge(e);
    await flushAll();
    expect(calls.length).toBe(1);
    p.dispose();
  });
});

describe('which setups count as open in an editor', () => {
  it('only a persist attached to the page by a mounted editor, not one a discarded render made', () => {
    const editor = createEditor(doc);
    const { c } = client();
    // A render React throws away made this persist and never mounted it.
    const orphan = createPersist(editor, { setup: { ...setup, id: 'orphan-1' }, client: c, storage: null, queue: null });
    expect(isOpenInEditor('orphan-1')).toBe(false);
    // The mounted editor attaches its own; leaving detaches it.
    const target = new EventTarget() as unknown as Parameters<typeof attachToPage>[1];
    const mounted = createPersist(editor, { setup: { ...setup, id: 'open-1' }, client: c, storage: null, queue: null });
    const detach = attachToPage(mounted, target);
    expect(isOpenInEditor('open-1')).toBe(true);
    detach();
    mounted.dispose();
    expect(isOpenInEditor('open-1')).toBe(false);
    orphan.dispose();
  });
});
