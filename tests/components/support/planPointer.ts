// A hand on the plan as the web build gets it: pointer events on the plan's surface (canvas/planPointer.ts
// listens for the press there and for the moves and release on the window). jsdom lays nothing out, so the
// surface's box is at 0,0 and a point's client coordinates are the plan's screen coordinates.
import { screen } from '@testing-library/react';

type Step = { type: 'down' | 'move' | 'up'; x: number; y: number };

/** Dispatches each step as one pointer event of the mouse (button 0). */
export function firePlanPointer(steps: Step[], pointerId = 1) {
  const surface = screen.getByTestId('plan-pointer-surface');
  for (const s of steps) {
    const init: PointerEventInit = { pointerId, pointerType: 'mouse', button: 0, buttons: s.type === 'up' ? 0 : 1, clientX: s.x, clientY: s.y, bubbles: true, cancelable: true };
    const target = s.type === 'down' ? surface : window;
    target.dispatchEvent(new PointerEvent(`pointer${s.type}`, init));
  }
}
