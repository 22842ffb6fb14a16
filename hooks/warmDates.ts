// The first date a page formats has the browser build a date formatter from its locale data: 140–170 ms on the
// phone profile (startProfile), inside the render of the library's cards and of the share screen's header. The
// root asks for it once, in a task of its own soon after its first render (idle, at most 300 ms late: the page
// is rarely idle while it loads), while the page still waits for its
// chunks and data, through the very formatter (and cache) those screens use (model/format.ts).
import { useEffect } from 'react';
import { formatDate } from '../model/format';

type IdleScope = { requestIdleCallback?: (cb: () => void, o: { timeout: number }) => number; cancelIdleCallback?: (id: number) => void };

export function useWarmDates() {
  useEffect(() => {
    const { requestIdleCallback: request, cancelIdleCallback: cancel } = globalThis as IdleScope;
    // (Phones have no idle callback: nothing to move there.)
    if (!request || !cancel) return;
    const id = request(() => void formatDate(0), { timeout: 300 });
    return () => cancel(id);
  }, []);
}
