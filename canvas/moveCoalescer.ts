// Pointer moves reach the editor at most once an animation frame, the newest. Browsers deliver pointer moves at
// the start of a frame, before its animation-frame callbacks; so the first move of a frame is applied at once,
// and the drag layer's DOM writes land in the frame being drawn. (Applied from an animation-frame callback of
// our own, registered during the move, they came after the callbacks registered a frame earlier — another
// view's, a sampler's — and a browser that dispatched the move late showed it a frame late.) That first move
// opens the frame's window: a further move before the next frame waits for it, the newest replacing the
// waiting one, and is applied in that frame's callback, which opens the next window.
export type FrameClock = { request: (f: () => void) => number; cancel: (id: number) => void };

/** One frame's wait: animation frames, or a 16 ms timer where there are none (e.g. a headless test). */
export const animationFrames: FrameClock = {
  request: (f) => (typeof requestAnimationFrame === 'function' ? requestAnimationFrame(f) : (setTimeout(f, 16) as unknown as number)),
  cancel: (id) => (typeof cancelAnimationFrame === 'function' ? cancelAnimationFrame(id) : clearTimeout(id)),
};

export type MoveCoalescer<P> = {
  /** A pointer move: applied now if none was applied since the last frame, else at the next frame. */
  queue: (p: P) => void;
  /** Apply the waiting move now (a release), or `p` in its place. */
  flush: (p?: P) => void;
};

export function coalesceMoves<P>(apply: (p: P) => void, clock: FrameClock = animationFrames): MoveCoalescer<P> {
  let waiting: P | null = null;
  let frame: number | null = null;
  const take = () => {
    const p = waiting;
    waiting = null;
    if (p !== null) apply(p);
  };
  const onFrame = () => {
    frame = null;
    if (waiting === null) return;
    take();
    frame = clock.request(onFrame);
  };
  return {
    queue(p) {
      waiting = p;
      if (frame !== null) return;
      take();
      frame = clock.request(onFrame);
    },
    flush(p) {
      if (p !== undefined) waiting = p;
      if (frame !== null) clock.cancel(frame);
      frame = null;
      take();
    },
  };
}
