import { describe, expect, it } from 'vitest';
import { coalesceMoves, type FrameClock } from '../../../canvas/moveCoalescer';

// A clock whose frames run when the test says.
function frames() {
  const waiting = new Map<number, () => void>();
  let next = 1;
  const clock: FrameClock = {
    request: (f) => {
      waiting.set(next, f);
      return next++;
    },
    cancel: (id) => void waiting.delete(id),
  };
  const tick = () => {
    const now = [...waiting.values()];
    waiting.clear();
    now.forEach((f) => f());
  };
  return { clock, tick, pending: () => waiting.size };
}

describe('coalesceMoves', () => {
  it('applies the first move of a frame at once and the newest of the rest at the next frame', () => {
    const f = frames();
    const seen: number[] = [];
    const c = coalesceMoves<number>((p) => seen.push(p), f.clock);
    c.queue(1);
    c.queue(2);
    c.queue(3);
    expect(seen).toEqual([1]);
    f.tick();
    expect(seen).toEqual([1, 3]);
    // The frame that applied a waiting move opened the next window: a move before the next frame waits.
    c.queue(4);
    expect(seen).toEqual([1, 3]);
    f.tick();
    expect(seen).toEqual([1, 3, 4]);
    // A frame with nothing waiting closes the window: the next move is applied at once.
    f.tick();
    expect(f.pending()).toBe(0);
    c.queue(5);
    expect(seen).toEqual([1, 3, 4, 5]);
  });

  it('flushes the waiting move (or the one it is given) now and forgets the frame', () => {
    const f = frames();
    const seen: number[] = [];
    const c = coalesceMoves<number>((p) => seen.push(p), f.clock);
    c.queue(1);
    c.queue(2);
    c.flush();
    expect(seen).toEqual([1, 2]);
    expect(f.pending()).toBe(0);
    c.flush(7);
    expect(seen).toEqual([1, 2, 7]);
    c.flush();
    f.tick();
    expect(seen).toEqual([1, 2, 7]);
  });
});
