// The live meter follows the editor at its own pace: one job at a time, only the newest document sent next,
// and when the hand has stopped an older result is not shown (at most one update behind).
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createEditor } from '../../../canvas/editor/editor';
import type { MeterEngine, MeterJob } from '../../../canvas/meter/engine';
import { GESTURE_GAP_MS, SHOW_SHARE, createMeter } from '../../../canvas/meter/meter';
import { demoSetups } from '../../../db/seed-setups';
import { computeReadings } from '../../../model/setupReadings';

function manualEngine() {
  const jobs: { job: MeterJob; resolve: () => void }[] = [];
  const engine: MeterEngine = {
    kind: 'inline',
    compute: (job) => new Promise((resolve) => jobs.push({ job, resolve: () => resolve(computeReadings(job.doc, job)) })),
    dispose: () => {},
  };
  return { engine, jobs };
}
const flush = () => new Promise((r) => setTimeout(r, 0));
/** A demo setup on a plan at 100 px/m, its meter on a manual engine and a clock the test moves. */
function meterOnPlan() {
  const e = createEditor(demoSetups[0]!.document);
  e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
  const { engine, jobs } = manualEngine();
  const clock = { t: 0 };
  const m = createMeter(e, { lightMap: false }, engine, () => clock.t);
  return { e, jobs, m, clock };
}

describe('the live meter', () => {
  it('opens with no readings and computes none itself; start() sends one job, numbers and light map together', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const m = createMeter(e, { lightMap: true }, engine, () => 0);
    // Still reading: nothing computed in the caller's task (the editor's first render), nothing asked yet.
    expect(m.getState().readings).toBeNull();
    expect(m.getState().doc).toBe(e.getState().doc);
    expect(jobs).toHaveLength(0);
    m.start();
    m.start();
    expect(jobs).toHaveLength(1);
    expect(jobs[0]!.job).toEqual({ doc: e.getState().doc, lightMap: true, stepIndex: undefined });
    expect(m.getState().computing).toBe(true);
    expect(m.getState().readings).toBeNull();
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().readings?.meter?.subject.aperture).toBe(computeReadings(e.getState().doc).meter!.subject.aperture);
    expect(m.getState().readings?.map?.stops.length).toBeGreaterThan(0);
    expect(m.getState().computing).toBe(false);
    m.start();
    expect(jobs).toHaveLength(1);
    m.dispose();
  });

  it('readFirst computes the numbers in the page in later tasks, the same as the meter would, and sends no job', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const m = createMeter(e, { lightMap: true }, engine, () => 0);
    m.readFirst();
    // Not in the caller's task: its first step only prepares the room.
    expect(m.getState().readings).toBeNull();
    await flush();
    await flush();
    await flush();
    const want = computeReadings(e.getState().doc, { lightMap: false });
    expect(m.getState().readings?.meter).toEqual(want.meter);
    expect(m.getState().readings?.map).toBeNull();
    expect(m.getState().doc).toBe(e.getState().doc);
    expect(jobs).toHaveLength(0);
    // The light map comes from the engine, whose answer replaces the numbers.
    m.start();
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().readings?.map).not.toBeNull();
    m.dispose();
  });

  it('readFirst shows nothing once the engine has answered; after a change it reads the plan as it stands', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const m = createMeter(e, { lightMap: true }, engine, () => 0);
    m.start();
    m.readFirst();
    jobs[0]!.resolve();
    await flush();
    const fromEngine = m.getState().readings;
    expect(fromEngine?.map).not.toBeNull();
    await flush();
    await flush();
    expect(m.getState().readings).toBe(fromEngine);
    m.dispose();

    const e2 = createEditor(demoSetups[0]!.document);
    const held = manualEngine();
    const m2 = createMeter(e2, { lightMap: false }, held.engine, () => 0);
    m2.readFirst();
    e2.dispatch('select', { ids: ['key'] });
    e2.dispatch('nudge', { dx: 0.5, dy: 0 });
    await flush();
    await flush();
    // Not the opening plan's numbers: the moved light's, and not final while the engine's job is out.
    expect(m2.getState().doc).toBe(e2.getState().doc);
    expect(m2.getState().readings?.meter).toEqual(computeReadings(e2.getState().doc).meter);
    expect(m2.getState().computing).toBe(true);
    held.jobs[0]!.resolve();
    await flush();
    expect(m2.getState().computing).toBe(false);
    m2.dispose();
  });

  it('setting the options it already has sends no job (the first answer is not made stale by a screen mounting)', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const m = createMeter(e, { lightMap: true }, engine, () => 0);
    m.start();
    m.setOptions({ lightMap: true });
    m.setOptions({ stepIndex: undefined });
    jobs[0]!.resolve();
    await flush();
    expect(jobs).toHaveLength(1);
    expect(m.getState().readings?.map).not.toBeNull();
    m.setOptions({ lightMap: false });
    expect(jobs).toHaveLength(2);
    expect(jobs[1]!.job.lightMap).toBe(false);
    m.dispose();
  });

  it('a change before start() sends the first job; start() then sends no second one', () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const m = createMeter(e, { lightMap: false }, engine, () => 0);
    e.dispatch('select', { ids: ['key'] });
    e.dispatch('nudge', { dx: 0.1, dy: 0 });
    expect(jobs).toHaveLength(1);
    m.start();
    expect(jobs).toHaveLength(1);
    m.dispose();
  });

  it('runs one job at a time and sends only the newest document next', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    const t = 0;
    const m = createMeter(e, { lightMap: false }, engine, () => t);
    e.dispatch('select', { ids: ['key'] });
    for (let k = 0; k < 5; k++) e.dispatch('nudge', { dx: 0.1, dy: 0 });
    expect(jobs.length).toBe(1); // the rest wait
    // The hand is still moving: the older result is shown, and the newest document goes next.
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(jobs[0]!.job.doc);
    expect(jobs.length).toBe(2);
    expect(jobs[1]!.job.doc).toBe(e.getState().doc);
    jobs[1]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(e.getState().doc);
    expect(m.getState().computing).toBe(false);
    m.dispose();
  });

  it('when the hand has stopped, a result for an older document is skipped', async () => {
    const e = createEditor(demoSetups[0]!.document);
    const { engine, jobs } = manualEngine();
    let t = 0;
    const m = createMeter(e, { lightMap: false }, engine, () => t);
    const first = m.getState().doc;
    e.dispatch('select', { ids: ['key'] });
    e.dispatch('nudge', { dx: 0.1, dy: 0 });
    e.dispatch('nudge', { dx: 0.1, dy: 0 });
    t += 500; // the hand stopped
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(first); // not the stale one
    jobs[1]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(e.getState().doc);
    m.dispose();
  });

  it('follows a drag under way (the moves held beside the document), and the release computes nothing more', async () => {
    const { e, jobs, m, clock } = meterOnPlan();
    const keyX = (d: { items: readonly { id: string }[] }) => (d.items.find((i) => i.id === 'key') as unknown as { x: number }).x;
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'mouse' });
    for (let k = 1; k <= 5; k++) e.pointer.move({ screen: { x: 400 + k * 20, y: 410 }, pointer: 'mouse' });
    expect(keyX(e.getState().doc)).toBe(4); // the document waits for the release
    expect(jobs.length).toBe(1);
    expect(keyX(jobs[0]!.job.doc)).toBeCloseTo(4.25); // the first move went out at once (4.2 m on the 0.25 m grid of 100 px/m)
    jobs[0]!.resolve();
    await flush();
    // While the hand drags, the next job waits out the gap since the last one started (the clock has not moved)…
    expect(jobs.length).toBe(1);
    await new Promise((r) => setTimeout(r, GESTURE_GAP_MS + 15));
    expect(jobs.length).toBe(2); // …then the newest goes
    expect(keyX(jobs[1]!.job.doc)).toBeCloseTo(5);
    clock.t += 500;
    jobs[1]!.resolve();
    await flush();
    expect(keyX(m.getState().doc)).toBeCloseTo(5);
    e.pointer.up({ screen: { x: 500, y: 410 }, pointer: 'mouse' });
    await flush();
    expect(keyX(e.getState().doc)).toBeCloseTo(5);
    expect(jobs.length).toBe(2); // the released document is the one just computed
    m.dispose();
  });

  it('while a hand drags, jobs start at most every GESTURE_GAP_MS; edits outside a gesture go at once', async () => {
    const { e, jobs, m, clock } = meterOnPlan();
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'mouse' });
    e.pointer.move({ screen: { x: 420, y: 410 }, pointer: 'mouse' });
    expect(jobs.length).toBe(1);
    clock.t += 10;
    e.pointer.move({ screen: { x: 440, y: 410 }, pointer: 'mouse' });
    jobs[0]!.resolve();
    await flush();
    expect(jobs.length).toBe(1); // 10 ms after the last start: waits
    clock.t += GESTURE_GAP_MS;
    await new Promise((r) => setTimeout(r, GESTURE_GAP_MS + 15));
    expect(jobs.length).toBe(2);
    clock.t += 500;
    jobs[1]!.resolve();
    e.pointer.up({ screen: { x: 440, y: 410 }, pointer: 'mouse' });
    await flush();
    // No gesture: a nudge right after a job started goes out as soon as that job is done, with no gap.
    e.dispatch('select', { ids: ['key'] });
    e.dispatch('nudge', { dx: 0.1, dy: 0 });
    expect(jobs.length).toBe(3);
    e.dispatch('nudge', { dx: 0.1, dy: 0 });
    jobs[2]!.resolve();
    await flush();
    expect(jobs.length).toBe(4);
    m.dispose();
  });

  it('a drag let go while a job waits out the gap: not settled meanwhile, and the job goes at once', async () => {
    const { e, jobs, m, clock } = meterOnPlan();
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'mouse' });
    e.pointer.move({ screen: { x: 420, y: 410 }, pointer: 'mouse' });
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().computing).toBe(false);
    clock.t += 10;
    e.pointer.move({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
    // Waiting out the gap: the readings shown are for an older place, so a panel must not take them as final.
    expect(jobs.length).toBe(1);
    expect(m.getState().computing).toBe(true);
    e.pointer.up({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
    // The hand is off the plan: no gap to wait out.
    expect(jobs.length).toBe(2);
    expect(jobs[1]!.job.doc).toBe(e.getState().doc);
    jobs[1]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(e.getState().doc);
    expect(m.getState().computing).toBe(false);
    m.dispose();
  });

  it('a result for an older place arriving just after the hand lets go is not shown (one step, to where it stopped)', async () => {
    const { e, jobs, m } = meterOnPlan();
    const before = m.getState().doc;
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'mouse' });
    e.pointer.move({ screen: { x: 420, y: 410 }, pointer: 'mouse' });
    e.pointer.move({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
    // Let go within SETTLE_MS of the last move (the clock has not moved), with the first job still running.
    e.pointer.up({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
    jobs[0]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(before);
    expect(jobs.length).toBe(2);
    jobs[1]!.resolve();
    await flush();
    expect(m.getState().doc).toBe(e.getState().doc);
    m.dispose();
  });

  describe('where showing a result is costly (a slow phone)', () => {
    afterEach(() => vi.useRealTimers());
    it('widens the gap between jobs during a drag so showing results takes at most 1 / SHOW_SHARE of the thread', async () => {
      vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
      const { e, jobs, m, clock } = meterOnPlan();
      // Each result shown costs this thread 30 ms (its listeners: React's render of the panels and the map).
      const COST = 30;
      m.subscribe((st, prev) => {
        if (st.readings !== prev.readings) clock.t += COST;
      });
      e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'mouse' });
      e.pointer.move({ screen: { x: 420, y: 410 }, pointer: 'mouse' });
      e.pointer.move({ screen: { x: 440, y: 410 }, pointer: 'mouse' });
      expect(jobs.length).toBe(1);
      // The first result: shown (30 ms), the newest document goes next after the plain gap.
      jobs[0]!.resolve();
      await vi.advanceTimersByTimeAsync(GESTURE_GAP_MS);
      expect(jobs.length).toBe(2);
      const started = clock.t;
      e.pointer.move({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
      jobs[1]!.resolve();
      await vi.advanceTimersByTimeAsync(0);
      // The second result cost 30 ms too: with what the first cost (weighted 0.4 → 12 ms), the gap is now
      // SHOW_SHARE × 12 = 48 ms from the last start, where the plain gap would have sent it 3 ms after it was shown.
      const gap = SHOW_SHARE * 0.4 * COST;
      expect(gap).toBeGreaterThan(GESTURE_GAP_MS);
      const wait = started + gap - clock.t;
      await vi.advanceTimersByTimeAsync(wait - 5);
      expect(jobs.length).toBe(2);
      await vi.advanceTimersByTimeAsync(10);
      expect(jobs.length).toBe(3);
      e.pointer.up({ screen: { x: 460, y: 410 }, pointer: 'mouse' });
      m.dispose();
    });
  });
});
