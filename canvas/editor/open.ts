// "Open this item's settings": a request, not a state. Only a deliberate choice of one item makes it — a tap
// on its glyph, or picking it by name (the plan's item buttons, a list). A selection that comes from a drag,
// an undo or redo, a box or the program itself changes what is selected but asks to open nothing, so a phone's
// sheet does not jump to the item's settings under a hand that was doing something else.

type OpenListener = (id: string) => void;

export type OpenRequests = {
  /** Ask for the settings of `id` to be shown (the caller has selected it). */
  request: (id: string) => void;
  /** Listen for requests; returns the unsubscribe. */
  subscribe: (fn: OpenListener) => () => void;
};

export function createOpenRequests(): OpenRequests {
  const listeners = new Set<OpenListener>();
  return {
    request: (id) => {
      for (const fn of [...listeners]) fn(id);
    },
    subscribe: (fn) => {
      listeners.add(fn);
      return () => {
        listeners.delete(fn);
      };
    },
  };
}
