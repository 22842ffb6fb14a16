// A sliding-window limit per key (a user's sends), kept in this process. With several server processes each
// keeps its own count; a shared store would be the next step then.
export function windowLimit(max: number, windowMs: number) {
  const hits = new Map<string, number[]>();
  return {
    /** Count one use; returns 0 when allowed, else the seconds until the oldest use leaves the window. */
    take(key: string, now = Date.now()): number {
      const recent = (hits.get(key) ?? []).filter((t) => now - t < windowMs);
      if (recent.length >= max) {
        hits.set(key, recent);
        return Math.ceil((recent[0]! + windowMs - now) / 1000);
      }
      recent.push(now);
      hits.set(key, recent);
      if (hits.size > 10_000) hits.delete(hits.keys().next().value!);
      return 0;
    },
  };
}
