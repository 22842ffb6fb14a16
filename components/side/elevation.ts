// The side view's geometry: the room cut along a line on the plan (from the camera, or from a chosen light,
// to the subject), with everything seen from the side at its height. Pure: plan items in, shapes in the
// view's pixels out, and the way back from a drag to a height or a tilt.
import { GELS, MODIFIERS } from '../../calc';
import { lightInk } from '../../drawing/glyphs';
import { graphiteTheme } from '../../drawing/theme';
import type { Item, ItemOf, SetupDocument } from '../../model/document';
import type { Point } from '../../model/geometry';
import { sensorFormats } from '../../model/items/camera';
import { itemNames } from '../../model/kinds';

export type SideBox = { w: number; h: number };
/** Along the line (metres from the line's start, the camera or light) and up from the floor (metres). */
export type SidePoint = { u: number; z: number };

/** Items further than this from the line are drawn faint: they are seen from the side, not on the cut. */
const NEAR_LINE_M = 1.5;
const PAD_PX = 28;
/** The drawn length of a light's beam in the view, metres (shorter where it meets the floor or the ceiling). */
const SIDE_BEAM_REACH_M = 2.2;
/** The drawn length of a tilt handle's arm, metres. */
const TILT_ARM_M = 0.8;

type SideLine = { from: Point; to: Point; fromId: string; toId: string };

/** The line the view cuts along: from `refId` (default: the first camera) to the first subject. */
function sideLine(doc: SetupDocument, refId?: string | null): SideLine | null {
  const subject = doc.items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  const ref = (refId ? doc.items.find((i) => i.id === refId && (i.kind === 'camera' || i.kind === 'light')) : undefined) ?? doc.items.find((i) => i.kind === 'camera');
  if (!subject || !ref || !('x' in ref)) return null;
  const from = { x: ref.x, y: ref.y };
  const to = { x: subject.x, y: subject.y };
  if (Math.hypot(to.x - from.x, to.y - from.y) < 1e-6) return null;
  return { from, to, fromId: ref.id, toId: subject.id };
}

/** A plan point on the view: how far along the line, and how far off it (metres). */
function along(line: SideLine, p: Point): { u: number; off: number } {
  const dx = line.to.x - line.from.x;
  const dy = line.to.y - line.from.y;
  const len = Math.hypot(dx, dy);
  const ex = dx / len;
  const ey = dy / len;
  const rx = p.x - line.from.x;
  const ry = p.y - line.from.y;
  return { u: rx * ex + ry * ey, off: Math.abs(rx * ey - ry * ex) };
}

export type SideShape =
  | { kind: 'subject'; id: string; at: SidePoint; faint: boolean; label: string; pose: 'standing' | 'seated' }
  | { kind: 'camera'; id: string; at: SidePoint; tiltDeg: number; facing: 1 | -1; halfFovDeg: number; faint: boolean; label: string }
  | { kind: 'light'; id: string; at: SidePoint; tiltDeg: number; facing: 1 | -1; halfDeg: number; /** The head's ink and the beam's fill: the gel's colours as the plan draws them. */ tint: string; beam: string; on: boolean; faint: boolean; label: string }
  | { kind: 'panel'; id: string; bottom: SidePoint; top: SidePoint; faint: boolean; label: string }
  | { kind: 'wall'; id: string; u: number; top: number; label: string };

export type SideScene = {
  line: SideLine;
  shapes: SideShape[];
  ceiling: number | null;
  /** Metres shown: u from u0 to u1, z from 0 to z1. */
  u0: number;
  u1: number;
  z1: number;
};

/** Which way along the line an item aiming at `deg` on the plan faces (towards the end, or back). */
function facingOf(line: SideLine, deg: number): 1 | -1 {
  const r = (deg * Math.PI) / 180;
  const dx = line.to.x - line.from.x;
  const dy = line.to.y - line.from.y;
  return Math.cos(r) * dx + Math.sin(r) * dy >= 0 ? 1 : -1;
}

/** Where a wall crosses the line (u), or null when it does not. */
function crossing(line: SideLine, a: Point, b: Point): number | null {
  const d = { x: line.to.x - line.from.x, y: line.to.y - line.from.y };
  const e = { x: b.x - a.x, y: b.y - a.y };
  const den = d.x * e.y - d.y * e.x;
  if (Math.abs(den) < 1e-9) return null;
  const w = { x: a.x - line.from.x, y: a.y - line.from.y };
  const t = (w.x * e.y - w.y * e.x) / den;
  const s = (w.x * d.y - w.y * d.x) / den;
  if (s < 0 || s > 1) return null;
  return t * Math.hypot(d.x, d.y);
}

export function sideScene(doc: SetupDocument, refId?: string | null, shown?: readonly Item[]): SideScene | null {
  const line = sideLine(doc, refId);
  if (!line) return null;
  const shapes: SideShape[] = [];
  const items = shown ?? doc.items;
  // The names people see ("Key", "Light 2"), never an internal id.
  const names = itemNames(doc.items);
  for (const i of items) {
    switch (i.kind) {
      case 'subject': {
        const { u, off } = along(line, i);
        shapes.push({ kind: 'subject', id: i.id, at: { u, z: i.faceHeightM }, faint: off > NEAR_LINE_M, label: names.get(i.id) ?? (i.label || 'Subject'), pose: i.pose });
        break;
      }
      case 'camera': {
        const { u, off } = along(line, i);
        const half = (Math.atan(sensorFormats[i.sensor].heightMm / (2 * i.focalMm)) * 180) / Math.PI;
        shapes.push({ kind: 'camera', id: i.id, at: { u, z: i.heightM }, tiltDeg: i.tiltDeg, facing: facingOf(line, i.aimDeg), halfFovDeg: half, faint: off > NEAR_LINE_M, label: names.get(i.id) ?? (i.label || 'Camera') });
        break;
      }
      case 'light': {
        const { u, off } = along(line, i);
        const spec = MODIFIERS[i.modifier];
        const halfDeg = Math.min(80, i.gridDeg !== null ? Math.min(spec.halfAngleDeg, i.gridDeg / 2) : spec.halfAngleDeg);
        shapes.push({ kind: 'light', id: i.id, at: { u, z: i.heightM }, tiltDeg: i.tiltDeg, facing: facingOf(line, i.aimDeg), halfDeg, tint: lightInk(i.gel, graphiteTheme), beam: GELS[i.gel].tint, on: i.on, faint: off > NEAR_LINE_M, label: names.get(i.id) ?? (i.label || spec.label) });
        break;
      }
      case 'reflector':
      case 'flag':
      case 'vflat':
      case 'scrim': {
        const { u, off } = along(line, i);
        // A tilted panel leans back from its lower edge, away from the way its face points: its top edge moves
        // by h·sin(tilt) against the facing (projected on the line) and drops to h·cos(tilt) over the lower edge.
        const t = (i.tiltDeg * Math.PI) / 180;
        const r = (i.rotationDeg * Math.PI) / 180;
        const lean = i.heightM * Math.sin(t) * ((Math.cos(r) * (line.to.x - line.from.x) + Math.sin(r) * (line.to.y - line.from.y)) / Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y));
        shapes.push({ kind: 'panel', id: i.id, bottom: { u, z: i.baseM }, top: { u: u - lean, z: i.baseM + i.heightM * Math.cos(t) }, faint: off > NEAR_LINE_M, label: names.get(i.id) ?? (i.label || i.kind) });
        break;
      }
      case 'wall': {
        const u = crossing(line, i.a, i.b);
        if (u !== null) shapes.push({ kind: 'wall', id: i.id, u, top: i.heightM, label: names.get(i.id) ?? (i.label || 'Wall') });
        break;
      }
    }
  }
  const us = shapes.flatMap((s) => (s.kind === 'panel' ? [s.bottom.u, s.top.u] : s.kind === 'wall' ? [s.u] : [s.at.u]));
  const zs = shapes.flatMap((s) => (s.kind === 'panel' ? [s.top.z, s.bottom.z] : s.kind === 'wall' ? [Math.min(s.top, 4)] : [s.at.z]));
  const ceiling = doc.meter.ceiling.heightM;
  const u0 = Math.min(0, ...us) - 0.6;
  const u1 = Math.max(...us, along(line, line.to).u) + 0.8;
  const z1 = Math.max(2.2, ceiling !== null && ceiling <= 6 ? ceiling : 0, ...zs) + 0.3;
  return { line, shapes, ceiling, u0, u1, z1 };
}

/** Metres to the view's pixels: one scale for both axes (the room is not stretched), floor at the bottom. */
export function sideTransform(scene: Pick<SideScene, 'u0' | 'u1' | 'z1'>, box: SideBox) {
  const scale = Math.max(1, Math.min((box.w - 2 * PAD_PX) / (scene.u1 - scene.u0), (box.h - 2 * PAD_PX) / scene.z1));
  const left = (box.w - (scene.u1 - scene.u0) * scale) / 2;
  const floor = box.h - PAD_PX;
  return {
    scale,
    toPx: (p: SidePoint) => ({ x: left + (p.u - scene.u0) * scale, y: floor - p.z * scale }),
    toM: (x: number, y: number): SidePoint => ({ u: (x - left) / scale + scene.u0, z: (floor - y) / scale }),
  };
}

/** The end of a head's tilt arm (true angle, drawn in the view), metres. */
export function tiltHandle(at: SidePoint, tiltDeg: number, facing: 1 | -1): SidePoint {
  const r = (tiltDeg * Math.PI) / 180;
  return { u: at.u + facing * Math.cos(r) * TILT_ARM_M, z: at.z + Math.sin(r) * TILT_ARM_M };
}

/** The tilt that points a head at `at` from the view's point `p` (degrees, down is negative). */
export function tiltToward(at: SidePoint, p: SidePoint): number {
  return (Math.atan2(p.z - at.z, Math.max(0.05, Math.abs(p.u - at.u))) * 180) / Math.PI;
}

/**
 * The far ends of a light's drawn beam at its tilt ± its half angle: each edge runs SIDE_BEAM_REACH_M, or stops where
 * it meets the floor or the ceiling (a speedlight turned up to bounce is drawn up to the ceiling, not through it).
 */
export function beamEdges(sh: { at: SidePoint; tiltDeg: number; halfDeg: number; facing: 1 | -1 }, ceiling: number | null): [SidePoint, SidePoint] {
  const edge = (deg: number): SidePoint => {
    const c = Math.cos((deg * Math.PI) / 180);
    const sn = Math.sin((deg * Math.PI) / 180);
    let r = SIDE_BEAM_REACH_M;
    if (sn < 0) r = Math.min(r, sh.at.z / -sn);
    if (sn > 0 && ceiling !== null && ceiling > sh.at.z) r = Math.min(r, (ceiling - sh.at.z) / sn);
    return { u: sh.at.u + sh.facing * c * r, z: sh.at.z + sn * r };
  };
  return [edge(sh.tiltDeg + sh.halfDeg), edge(sh.tiltDeg - sh.halfDeg)];
}
