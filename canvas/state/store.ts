// The editor's store: one zustand store per open setup, read through selectors so a change re-renders
// only what reads it. Components dispatch actions by name.
import { createContext, useContext } from 'react';
import { createStore, useStore, type StoreApi } from 'zustand';
import type { SetupDocument } from '../../model/document';
import { run, type ActionArg, type ActionName } from './actions';
import { initialState, type EditorState } from './editor';

export type EditorStore = StoreApi<EditorState> & {
  dispatch: <N extends ActionName>(name: N, ...arg: ActionArg<N> extends void ? [] : [ActionArg<N>]) => void;
  /** Replace the document from outside (a reload or a conflict resolution); clears history. */
  load: (doc: SetupDocument, opts?: { readOnly?: boolean }) => void;
};

export function createEditorStore(doc: SetupDocument, opts: { readOnly?: boolean } = {}): EditorStore {
  const store = createStore<EditorState>(() => initialState(doc, opts));
  return Object.assign(store, {
    dispatch: ((name: ActionName, ...arg: unknown[]) => {
      const s = store.getState();
      const next = (run as (s: EditorState, n: ActionName, ...a: unknown[]) => EditorState)(s, name, ...arg);
      if (next !== s) store.setState(next, true);
    }) as EditorStore['dispatch'],
    load: (d: SetupDocument, o: { readOnly?: boolean } = {}) => store.setState({ ...initialState(d, o), revision: store.getState().revision + 1 }, true),
  });
}

export const EditorContext = createContext<EditorStore | null>(null);

export function useEditorStore(): EditorStore {
  const s = useContext(EditorContext);
  if (!s) throw new Error('useEditorStore outside an EditorContext');
  return s;
}

export function useEditor<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorStore(), selector);
}
