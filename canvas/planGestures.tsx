// The plan's press, drag, hold and tap on phones (iOS, Android), through gesture handler; the web reads the
// page's own pointer events instead (planGestures.web.tsx), so the share page does not download gesture
// handler. Both hand PlanCanvas the same calls, in the plan box's pixels.
import { useMemo, type ReactNode } from 'react';
import { Gesture, GestureDetector } from 'react-native-gesture-handler';
import type { Point } from '../model/geometry';
import { DRAG_MIN_PX, HOLD_MS, TAP_MAX_PX, type PlanGestureHandlers } from './planGestureTypes';

export type { PlanGestureHandlers } from './planGestureTypes';

export function PlanGestures({ handlers, children }: { handlers: PlanGestureHandlers; children: ReactNode }) {
  const gesture = useMemo(() => {
    let downAt: Point | null = null;
    const drag = Gesture.Pan()
      .withTestId('plan-drag')
      .runOnJS(true)
      .maxPointers(1)
      .minDistance(DRAG_MIN_PX)
      .onBegin((e) => {
        downAt = { x: e.x, y: e.y };
      })
      .onStart((e) => handlers.dragStart(downAt ?? { x: e.x - e.translationX, y: e.y - e.translationY }, { x: e.x, y: e.y }))
      .onUpdate((e) => handlers.dragMove({ x: e.x, y: e.y }))
      .onEnd((e) => handlers.dragRelease({ x: e.x, y: e.y }))
      .onFinalize((e) => handlers.dragEnd({ x: e.x, y: e.y }));
    const twoFingerPan = Gesture.Pan()
      .runOnJS(true)
      .minPointers(2)
      .onChange((e) => handlers.twoFingerPan(e.changeX, e.changeY));
    const pinch = Gesture.Pinch()
      .runOnJS(true)
      .onStart((e) => handlers.pinchStart({ x: e.focalX, y: e.focalY }))
      .onUpdate((e) => handlers.pinchUpdate(e.scale, { x: e.focalX, y: e.focalY }))
      .onFinalize(() => handlers.pinchEnd());
    const press = Gesture.Tap()
      .runOnJS(true)
      .maxDistance(TAP_MAX_PX)
      .onEnd((e, ok) => {
        if (ok) handlers.tap({ x: e.x, y: e.y });
      });
    const hold = Gesture.LongPress()
      .runOnJS(true)
      .minDuration(HOLD_MS)
      .onStart((e) => handlers.hold({ x: e.x, y: e.y }));
    return Gesture.Simultaneous(Gesture.Exclusive(drag, hold, press), pinch, twoFingerPan);
  }, [handlers]);
  return <GestureDetector gesture={gesture}>{children}</GestureDetector>;
}
