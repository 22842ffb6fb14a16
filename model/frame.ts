// From a setup document to the frame's input: the meter's scene (model/scene.ts, unchanged) plus what only the
// picture needs — the camera's tilt, the subject's skin tone and pose, props as boxes.
import type { FrameInput } from '../calc/frame';
import type { ItemOf, SetupDocument } from './document';
import { itemsAtStep, sceneFromDocument } from './documentToScene';

export type FrameBuild = { input: FrameInput | null; missing: string[]; assumedCamera: boolean };

/** The frame for the whole plan, or for the plan as it stands at one step (lessons show it per step). */
export function frameInputFromDocument(doc: SetupDocument, opts: { stepIndex?: number } = {}): FrameBuild {
  const build = sceneFromDocument(doc, opts);
  if (!build.scene) return { input: null, missing: build.missing, assumedCamera: build.assumedCamera };
  const items = itemsAtStep(doc, opts.stepIndex);
  const subject = items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  const camera = items.find((i): i is ItemOf<'camera'> => i.kind === 'camera');
  const props = items
    .filter((i): i is ItemOf<'prop'> => i.kind === 'prop')
    .slice(0, 64)
    .map((p) => ({ x: p.x, y: p.y, rotationDeg: p.rotationDeg, shape: p.shape }));
  return {
    input: {
      scene: build.scene,
      extras: {
        cameraTiltDeg: camera?.tiltDeg ?? 0,
        skinTone: subject?.skinTone ?? 'mid',
        pose: subject?.pose ?? 'standing',
        props,
      },
    },
    missing: build.missing,
    assumedCamera: build.assumedCamera,
  };
}
