/**
 * The frame: what the camera will record, computed from the meter's light transport (see README.md here).
 * Pure TypeScript: no React, no DOM, no I/O.
 */
export * from './scene';
export { type Field, type Receptor, exposureAt, prepareField } from './field';
export {
  FRAME_LIMITS,
  ID_CEILING,
  ID_FLAG,
  ID_FLOOR,
  ID_PROP,
  ID_SUBJECT,
  ID_SURFACE,
  ID_VOID,
  type FrameCamera,
  type FrameResult,
  type PreparedFrame,
  type RenderOptions,
  frameCamera,
  frameHeight,
  prepareFrame,
  projectToFrame,
  renderFrame,
} from './render';
export { type FrameLook, REC709_LUMA_WEIGHTS, applyLook, encode8 } from './looks';
export { FACE_FRONT_M } from './solids';
