// Leaving with work that has not reached the server warns first: a page close or reload (beforeunload), the
// browser's own Back and Forward (popstate, below) and the app's own ways out (confirmLeave before navigating).
// A screen registers what it would lose as a message.
import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';

type Guard = () => string | null;
const guards = new Set<{ current: Guard }>();

function message(): string | null {
  for (const g of guards) {
    const m = g.current();
    if (m) return m;
  }
  return null;
}

const onBeforeUnload = (e: BeforeUnloadEvent) => {
  const m = message();
  if (!m) return;
  e.preventDefault();
  // Older browsers show (or just need) returnValue.
  e.returnValue = m;
};

// The browser's Back/Forward. By the time `popstate` arrives the address has already changed, and the router's
// own listener (added when it mounts, before any of our modules load) resets to the new entry at once, which
// no navigation listener such as beforeRemove sees. Where the browser has the Navigation API, its `navigate`
// event comes first and a same-page Back can be cancelled: we ask there, and if the person stays, nothing
// moves. Elsewhere a popstate listener asks and steps the history back to where it was (its own step's
// popstate swallowed); it can only act before the router when it was added first, so there it is best effort.
let swallowNext = false;
/** An in-app way out the person just confirmed may step back through history itself (router.back): let it. */
let leaveConfirmedUntil = 0;
type NavigateEventLike = { navigationType: string; cancelable: boolean; preventDefault: () => void };
type NavigationLike = { addEventListener: (t: 'navigate', fn: (e: NavigateEventLike) => void) => void };
const navigationApi = (): NavigationLike | null => (typeof window !== 'undefined' ? ((window as unknown as { navigation?: NavigationLike }).navigation ?? null) : null);

const askToLeave = (): boolean => {
  const m = message();
  if (!m || Date.now() < leaveConfirmedUntil) return true;
  return typeof window.confirm !== 'function' || window.confirm(`${m}\n\nLeave anyway?`);
};

const onNavigate = (e: NavigateEventLike) => {
  if (e.navigationType !== 'traverse' || !e.cancelable) return;
  if (!askToLeave()) e.preventDefault();
};

const onPopState = (e: PopStateEvent) => {
  if (swallowNext) {
    swallowNext = false;
    e.stopImmediatePropagation();
    return;
  }
  if (askToLeave()) return;
  e.stopImmediatePropagation();
  // Back to the entry we were on: one step forward (the person pressed Back).
  swallowNext = true;
  window.history.go(1);
};

let historyGuarded = false;
/** Watch the browser's Back and Forward for the whole page. Call once, as early as possible. */
export function guardHistory() {
  if (historyGuarded || Platform.OS !== 'web' || typeof window === 'undefined') return;
  historyGuarded = true;
  const nav = navigationApi();
  if (nav) nav.addEventListener('navigate', onNavigate);
  else window.addEventListener('popstate', onPopState, { capture: true });
}

function listen(on: boolean) {
  if (Platform.OS !== 'web' || typeof window === 'undefined') return;
  if (on) window.addEventListener('beforeunload', onBeforeUnload);
  else window.removeEventListener('beforeunload', onBeforeUnload);
}

/** While mounted, `guard` says what leaving now would lose (null: nothing). Always the latest guard is asked. */
export function useLeaveGuard(guard: Guard) {
  const ref = useRef(guard);
  ref.current = guard;
  useEffect(() => {
    guards.add(ref);
    if (guards.size === 1) listen(true);
    return () => {
      guards.delete(ref);
      if (guards.size === 0) listen(false);
    };
  }, []);
}

/** Ask before an in-app way out: true when there is nothing to lose or the person chose to leave anyway. */
export function confirmLeave(): boolean {
  const m = message();
  if (!m) return true;
  if (Platform.OS === 'web' && typeof window !== 'undefined' && typeof window.confirm === 'function' && !window.confirm(`${m}\n\nLeave anyway?`)) return false;
  leaveConfirmedUntil = Date.now() + 3000;
  return true;
}

/** The words for edits still on this device. */
export function unsentMessage(waiting: number): string | null {
  if (waiting <= 0) return null;
  return `${waiting} change${waiting === 1 ? ' has' : 's have'} not reached the server yet. ${waiting === 1 ? 'It is' : 'They are'} kept on this device and sent when the connection is back — as long as this browser's storage is not cleared.`;
}
