// Focus kept after Delete (WCAG 2.4.3): deleting the focused item's marker, or pressing the settings' Delete
// button, removes the element that had the keyboard's focus and the browser drops focus to the page's start.
// This puts it on the item that followed the deleted one on the plan (the one before it when the last went),
// or on the plan itself when nothing is left. Web only.
import { useEffect } from 'react';
import { Platform } from 'react-native';
import type { Editor } from '../../canvas/editor/editor';
import { focusByTestId } from '../SkipLink';

/** The item to focus after `removed` went from `before` (ids in plan order): the next one left, else the one before. */
function focusAfter(before: readonly string[], removed: ReadonlySet<string>): string | null {
  const last = before.reduce((k, id, i) => (removed.has(id) ? i : k), -1);
  if (last < 0) return null;
  for (let i = last + 1; i < before.length; i++) if (!removed.has(before[i]!)) return before[i]!;
  for (let i = last - 1; i >= 0; i--) if (!removed.has(before[i]!)) return before[i]!;
  return null;
}

export function useFocusAfterDelete(editor: Editor, planTestId = 'plan', itemTestIdPrefix = 'item-') {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const unsubscribe = editor.subscribe((now, before) => {
      if (now.doc.items === before.doc.items || now.doc.items.length >= before.doc.items.length) return;
      const left = new Set(now.doc.items.map((i) => i.id));
      const removed = new Set(before.doc.items.filter((i) => !left.has(i.id)).map((i) => i.id));
      // Only a deletion of what was selected (Delete, the Delete button), not an undo of an addition elsewhere.
      if (!before.selection.some((id) => removed.has(id))) return;
      const next = focusAfter(
        before.doc.items.map((i) => i.id),
        removed,
      );
      if (timer) clearTimeout(timer);
      // The element with focus now (a marker, the settings' Delete button) goes when React removes it, which
      // may be a while after this (the settings render at low priority): watch for the focus to drop to the
      // page for a short time, and stop watching once the person has moved it somewhere else.
      const was = document.activeElement;
      const until = Date.now() + 2000;
      const check = () => {
        timer = null;
        const active = document.activeElement;
        const lost = !active || active === document.body || !active.isConnected;
        if (!lost) {
          if (active === was && Date.now() < until) timer = setTimeout(check, 50);
          return;
        }
        const plan = document.querySelector(`[data-testid="${planTestId}"]`);
        const marker = next ? plan?.querySelector<HTMLElement>(`[data-testid="${itemTestIdPrefix}${next}"]`) : null;
        if (marker) marker.focus();
        else focusByTestId(planTestId);
      };
      timer = setTimeout(check, 50);
    });
    return () => {
      unsubscribe();
      if (timer) clearTimeout(timer);
    };
  }, [editor, planTestId, itemTestIdPrefix]);
}
