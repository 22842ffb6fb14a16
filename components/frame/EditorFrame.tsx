// The frame view as the editor mounts it: reads the plan from the editor's store — the live plan while a hand
// drags (the gesture's moves are not in the document until it ends), taken at most every FRAME_PACE_MS, so the
// frame follows the drag with draft pictures without re-rendering beside the glyph on every pointer move — and
// sets the subject's skin tone through the store's update action (saved and undoable like any edit).
import { useWindowDimensions } from 'react-native';
import type { SkinTone } from '../../calc/frame/scene';
import { FRAME_PACE_MS, useEditorApi, usePaced } from '../../canvas/editor/react';
import { liveDoc } from '../../canvas/editor/state';
import { space } from '../../constants/theme';
import { FrameView } from './FrameView';

/** `offscreen`: out of sight (a phone's sheet lowered to its peek): holds through a gesture, no draft pictures. */
export function EditorFrame({ stepIndex, wide, readOnly, offscreen = false }: { stepIndex?: number; wide: boolean; readOnly: boolean; offscreen?: boolean }) {
  const store = useEditorApi();
  const doc = usePaced(store, liveDoc, offscreen ? null : FRAME_PACE_MS);
  const { width } = useWindowDimensions();
  const subject = doc.items.find((i) => i.kind === 'subject');
  const paneWidth = wide ? 340 - 2 * space.md : Math.min(640, width - 2 * space.md);
  const onSkinTone = !readOnly && subject ? (tone: SkinTone) => store.dispatch('updateItem', { id: subject.id, patch: { skinTone: tone } }) : undefined;
  return <FrameView doc={doc} stepIndex={stepIndex} paneWidth={paneWidth} onSkinTone={onSkinTone} />;
}
