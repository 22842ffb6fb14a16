// Panning the camera with a drag: shared by the select tool (empty space on touch, or Space held) and any
// tool that is asked to pan. The camera moves by the pointer's travel since the press.
import type { Point } from '../../../model/geometry';
import type { Camera } from '../camera';
import type { EditorCore } from '../editor';

export type Panning = { name: 'panning'; startCamera: Camera; startScreen: Point };

export function startPan(editor: EditorCore, screen: Point): Panning | null {
  const camera = editor.getState().camera;
  return camera ? { name: 'panning', startCamera: camera, startScreen: screen } : null;
}

export function movePan(editor: EditorCore, p: Panning, screen: Point) {
  editor.dispatch('setCamera', { camera: { ...p.startCamera, tx: p.startCamera.tx + screen.x - p.startScreen.x, ty: p.startCamera.ty + screen.y - p.startScreen.y } });
}
