// The bottom sheet's handle row as a vertical drag on the web: plain pointer events (sheetPointer.ts) on a box
// around the row, so the editor's page needs no gesture handler (the phones' version: sheetDrag.tsx).
import { useEffect, useRef, type ReactElement } from 'react';
import { View } from 'react-native';
import { attachSheetPointer } from './sheetPointer';
import type { SheetDragHandlers } from './sheetDragTypes';

export function SheetDrag({ handlers, children }: { handlers: SheetDragHandlers; children: ReactElement }) {
  const ref = useRef<View>(null);
  const current = useRef(handlers);
  current.current = handlers;
  useEffect(() => {
    const el = ref.current as unknown as HTMLElement | null;
    if (!el?.addEventListener) return;
    // A finger's vertical move is the sheet's, not the page's scroll; a sideways one still scrolls the row's tabs.
    el.style.touchAction = 'pan-x';
    return attachSheetPointer(el, () => current.current);
  }, []);
  return (
    <View ref={ref} collapsable={false}>
      {children}
    </View>
  );
}
