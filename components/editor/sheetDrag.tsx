// The bottom sheet's handle row as a vertical drag on phones: gesture handler's pan (on the web the page's own
// pointer events: sheetDrag.web.tsx).
import type { ReactElement } from 'react';
import { Gesture, GestureDetector } from 'react-native-gesture-handler';
import type { SheetDragHandlers } from './sheetDragTypes';

export function SheetDrag({ handlers, children }: { handlers: SheetDragHandlers; children: ReactElement }) {
  const drag = Gesture.Pan()
    .runOnJS(true)
    .onStart(() => handlers.start())
    .onUpdate((e) => handlers.move(e.translationY))
    .onEnd((e) => handlers.end(e.velocityY));
  return <GestureDetector gesture={drag}>{children}</GestureDetector>;
}
