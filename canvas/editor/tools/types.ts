// A tool is a small state machine driven by pointer down / move / up in screen pixels. It reads the editor
// and dispatches actions; it keeps its own state (which the tests read) and nothing else.
import type { Point } from '../../../model/geometry';
import type { PointerKind } from '../state';
import type { EditorCore } from '../editor';

export type PointerInput = { screen: Point; pointer: PointerKind };

export interface Tool<S extends { name: string } = { name: string }> {
  readonly id: string;
  state: S;
  down(editor: EditorCore, e: PointerInput): void;
  move(editor: EditorCore, e: PointerInput): void;
  up(editor: EditorCore, e: PointerInput): void;
  /** The pointer went away without a release (a gesture cancelled): finish as if released where it was. */
  cancel(editor: EditorCore): void;
}

let gestureCounter = 0;
/** A new gesture key: changes under one key coalesce into one undo step. */
export const newGestureKey = (what: string) => `${what}-${++gestureCounter}`;
