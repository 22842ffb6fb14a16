// React's view of the editor: a context holding the one editor object and selector hooks, so a change
// re-renders only what reads it. During a gesture, panels that do not follow the hand read `useSettled`,
// which holds its value until the gesture ends (a drag re-renders the dragged item, not the inspector).
import { createContext, useCallback, useContext, useRef, useSyncExternalStore } from 'react';
import { useStore, type StoreApi } from 'zustand';
import type { Editor } from './editor';
import type { EditorState } from './state';

export const EditorContext = createContext<Editor | null>(null);

export function useEditorApi(): Editor {
  const e = useContext(EditorContext);
  if (!e) throw new Error('useEditorApi outside an EditorContext');
  return e;
}

export function useEditor<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorApi(), selector);
}

/** Like useEditor, but while a gesture is under way the value stays as it was when the gesture began. */
export function useSettled<T>(selector: (s: EditorState) => T): T {
  const editor = useEditorApi();
  const last = useRef<{ value: T } | null>(null);
  const sel = useRef(selector);
  sel.current = selector;
  const subscribe = useCallback((notify: () => void) => editor.subscribe(notify), [editor]);
  const get = useCallback(() => {
    const s = editor.getState();
    if (s.gesture && last.current) return last.current.value;
    const v = sel.current(s);
    if (!last.current || !Object.is(last.current.value, v)) last.current = { value: v };
    return last.current.value;
  }, [editor]);
  return useSyncExternalStore(subscribe, get, get);
}

/** What an outside store (the live meter) holds, for panels that show text: it follows the store at once
 *  while no gesture is under way, and at most once every `everyMs` during one (numbers that change sixty
 *  times a second cannot be read, and each change is a large render beside the dragged glyph); the newest
 *  value is shown as soon as the gesture ends. */
export function usePaced<S, T>(store: StoreApi<S>, selector: (s: S) => T, everyMs = PANEL_PACE_MS): T {
  const editor = useEditorApi();
  const sel = useRef(selector);
  sel.current = selector;
  const shown = useRef<{ value: T; at: number } | null>(null);
  const subscribe = useCallback(
    (notify: () => void) => {
      let timer: ReturnType<typeof setTimeout> | null = null;
      const update = () => {
        if (timer) clearTimeout(timer);
        timer = null;
        const value = sel.current(store.getState());
        if (shown.current && Object.is(shown.current.value, value)) return;
        shown.current = { value, at: Date.now() };
        notify();
      };
      const changed = () => {
        if (!editor.getState().gesture) return update();
        const wait = everyMs - (Date.now() - (shown.current?.at ?? 0));
        if (wait <= 0) update();
        else timer ??= setTimeout(update, wait);
      };
      const offStore = store.subscribe(changed);
      const offEditor = editor.subscribe((s, prev) => {
        if (!s.gesture && prev.gesture) update();
      });
      return () => {
        offStore();
        offEditor();
        if (timer) clearTimeout(timer);
      };
    },
    [editor, store, everyMs],
  );
  const get = useCallback(() => {
    shown.current ??= { value: sel.current(store.getState()), at: 0 };
    return shown.current.value;
  }, [store]);
  return useSyncExternalStore(subscribe, get, get);
}

/** How often a text panel follows an outside store during a gesture. */
export const PANEL_PACE_MS = 250;
