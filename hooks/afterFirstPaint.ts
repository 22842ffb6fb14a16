// For a screen that paints its top first: false on the first render, true once the browser is idle after it
// (an idle callback, at most 300 ms late; a zero timer where there is none), set at transition priority, so
// what it gates renders in a task of its own rather than in the screen's first one.
import { startTransition, useEffect, useState } from 'react';

type IdleScope = { requestIdleCallback?: (cb: () => void, o: { timeout: number }) => number; cancelIdleCallback?: (id: number) => void };

export function useAfterFirstPaint(): boolean {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let done = false;
    const go = () => {
      if (!done) startTransition(() => setReady(true));
    };
    const { requestIdleCallback: request, cancelIdleCallback: cancel } = globalThis as IdleScope;
    if (request && cancel) {
      const id = request(go, { timeout: 300 });
      return () => {
        done = true;
        cancel(id);
      };
    }
    const t = setTimeout(go, 0);
    return () => {
      done = true;
      clearTimeout(t);
    };
  }, []);
  return ready;
}
