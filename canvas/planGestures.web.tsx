// The plan's gestures on the web: plain pointer events (planPointer.ts) on the plan's box, so the pages with a
// plan need no gesture handler (the phones' version: planGestures.tsx).
import { useEffect, useRef, type ReactElement } from 'react';
import { View } from 'react-native';
import type { PlanGestureHandlers } from './planGestureTypes';
import { attachPlanPointer } from './planPointer';

export function PlanGestures({ handlers, children }: { handlers: PlanGestureHandlers; children: ReactElement }) {
  const ref = useRef<View>(null);
  const current = useRef(handlers);
  current.current = handlers;
  useEffect(() => {
    const el = ref.current as unknown as HTMLElement | null;
    if (!el?.addEventListener) return;
    // The browser neither scrolls nor zooms the page under a finger on the plan, nor selects text on a drag.
    el.style.touchAction = 'none';
    el.style.userSelect = 'none';
    return attachPlanPointer(el, () => current.current);
  }, []);
  return (
    <View ref={ref} testID="plan-pointer-surface" style={{ position: 'absolute', left: 0, top: 0, right: 0, bottom: 0 }} collapsable={false}>
      {children}
    </View>
  );
}
