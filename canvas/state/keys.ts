// Keyboard shortcuts → actions. Arrows nudge 0.1 m (Shift: 1 m); Delete; Mod+Z / Mod+Shift+Z; Mod+D.
import type { EditorStore } from './store';

export type KeyInput = { key: string; shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey?: boolean };

/** Handle a key press; returns true when it was an editor shortcut (the caller then prevents the default). */
export function handleKey(store: EditorStore, e: KeyInput): boolean {
  const mod = e.ctrlKey || e.metaKey;
  const key = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  const step = e.shiftKey ? 1 : 0.1;
  const arrows: Record<string, [number, number]> = { ArrowUp: [0, -step], ArrowDown: [0, step], ArrowLeft: [-step, 0], ArrowRight: [step, 0] };
  if (!mod && arrows[key]) {
    const [dx, dy] = arrows[key]!;
    store.dispatch('nudge', { dx, dy });
    return true;
  }
  if (!mod && (key === 'Delete' || key === 'Backspace')) return store.dispatch('deleteSelection'), true;
  if (!mod && key === 'Escape') return store.dispatch('clearSelection'), true;
  if (mod && key === 'z') return store.dispatch(e.shiftKey ? 'redo' : 'undo'), true;
  if (mod && key === 'y') return store.dispatch('redo'), true;
  if (mod && key === 'd') return store.dispatch('duplicateSelection'), true;
  if (mod && key === 'a') return store.dispatch('selectAll'), true;
  if (mod && key === 'l') return store.dispatch('toggleLock'), true;
  return false;
}
