/**
 * The frame: what the camera will record, computed from the meter's light transport (see README.md here).
 * Pure TypeScript: no React, no DOM, no I/O.
 */
export * from './scene';
export { ID_SUBJECT, ID_SURFACE, type FrameResult, projectToFrame, renderFrame } from './render';
export { REC709_LUMA_WEIGHTS, applyLook, encode8 } from './looks';
export { FACE_FRONT_M } from './solids';
