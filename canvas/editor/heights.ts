// Heights and tilts, set by hand on the plan's height handle and in the side view: what each kind keeps as
// its height, and the limits (above the floor, under the ceiling, tilts within ±90°).
import type { Item, SetupDocument } from '../../model/document';

/** Kept between a head and the ceiling, metres (a stand cannot push a head into it). */
const CEILING_GAP_M = 0.1;
const MIN_HEIGHT_M = 0.1;
const MAX_HEIGHT_M = 10;

/** The height the side view and the handles move: a light's or camera's lens/head height, a subject's face. */
export function heightOf(i: Item): number | null {
  if (i.kind === 'light' || i.kind === 'camera') return i.heightM;
  if (i.kind === 'subject') return i.faceHeightM;
  return null;
}

/** The highest a head may go: under the ceiling when the room has one. */
export function maxHeight(doc: SetupDocument): number {
  const ceiling = doc.meter.ceiling.heightM;
  return ceiling === null ? MAX_HEIGHT_M : Math.min(MAX_HEIGHT_M, ceiling - CEILING_GAP_M);
}

export function setHeight(i: Item, heightM: number, doc: SetupDocument, snap: boolean): Item {
  if (i.locked || !Number.isFinite(heightM)) return i;
  const step = snap ? 0.05 : 0.01;
  const h = Math.round(Math.min(maxHeight(doc), Math.max(MIN_HEIGHT_M, heightM)) / step) * step;
  const v = Math.round(h * 1000) / 1000;
  if (i.kind === 'light' || i.kind === 'camera') return i.heightM === v ? i : { ...i, heightM: v };
  if (i.kind === 'subject') return i.faceHeightM === v ? i : { ...i, faceHeightM: Math.min(5, v) };
  return i;
}

export function setTilt(i: Item, tiltDeg: number, snap: boolean): Item {
  if (i.locked || !Number.isFinite(tiltDeg) || (i.kind !== 'light' && i.kind !== 'camera')) return i;
  const step = snap ? 5 : 1;
  const t = Math.round(Math.min(90, Math.max(-90, tiltDeg)) / step) * step;
  return i.tiltDeg === t ? i : { ...i, tiltDeg: t };
}
