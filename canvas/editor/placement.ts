// Where a new item lands: near the middle of what the plan shows (above the phone's sheet), in a free spot
// so that items added one after another do not pile up, and turned sensibly: a camera or a light faces the
// subject, a subject faces the camera. Pure functions of the document and the view.
import type { Item, ItemKind, ItemOf, SetupDocument } from '../../model/document';
import { direction, type Point } from '../../model/geometry';
import { anchorOf, angleTo, isSegment, kinds } from '../../model/kinds';
import { toPlan, type Camera } from './camera';

/** Clear space wanted around a new item's centre, metres (about a stand's footprint, common practice). */
export const FREE_RADIUS_M = 0.7;
/** Kept between a new item and the stage's edge, metres. */
const EDGE_M = 0.3;

/** The plan point in the middle of the part of the plan box not covered (by the phone's sheet). */
export function viewCentre(camera: Camera | null, viewport: { w: number; h: number; insetBottom: number }, stage: SetupDocument['stage']): Point {
  if (!camera || viewport.w <= 0) return { x: stage.widthM / 2, y: stage.depthM / 2 };
  return toPlan(camera, viewport.w / 2, Math.max(0, viewport.h - viewport.insetBottom) / 2);
}

const inside = (p: Point, stage: SetupDocument['stage']) => p.x >= EDGE_M && p.y >= EDGE_M && p.x <= stage.widthM - EDGE_M && p.y <= stage.depthM - EDGE_M;
const clampTo = (p: Point, stage: SetupDocument['stage']): Point => ({
  x: Math.min(stage.widthM - EDGE_M, Math.max(EDGE_M, p.x)),
  y: Math.min(stage.depthM - EDGE_M, Math.max(EDGE_M, p.y)),
});

/** How far a point is from the nearest item already on the plan (segments by their line), metres. */
function clearance(p: Point, items: readonly Item[]): number {
  let d = Infinity;
  for (const i of items) {
    if (i.kind === 'note' || i.kind === 'arrow' || i.kind === 'tape') continue;
    if (isSegment(i)) {
      const { a, b } = i;
      const dx = b.x - a.x;
      const dy = b.y - a.y;
      const len2 = dx * dx + dy * dy;
      const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
      d = Math.min(d, Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy)));
    } else {
      const c = anchorOf(i);
      d = Math.min(d, Math.hypot(p.x - c.x, p.y - c.y) - kinds[i.kind].radiusM);
    }
  }
  return d;
}

/**
 * The free spot nearest to `centre`: candidates on rings 0.5 m apart (the centre first, then 8, 16, 24 …
 * points per ring), on a 0.1 m grid, inside the stage. The first with FREE_RADIUS_M of clear space wins;
 * when the stage is full, the candidate with the most space.
 */
export function freeSpot(items: readonly Item[], stage: SetupDocument['stage'], centre: Point): Point {
  const start = clampTo(centre, stage);
  let best = { p: start, room: clearance(start, items) };
  if (best.room >= FREE_RADIUS_M) return tidyPoint(start);
  const maxRing = Math.ceil(Math.hypot(stage.widthM, stage.depthM) / 0.5);
  for (let ring = 1; ring <= maxRing; ring++) {
    const n = 8 * ring;
    for (let k = 0; k < n; k++) {
      // Start below-right of the centre and go round: the subject's usual spot stays free for the subject.
      const a = Math.PI / 4 + (2 * Math.PI * k) / n;
      const p = { x: start.x + Math.cos(a) * ring * 0.5, y: start.y + Math.sin(a) * ring * 0.5 };
      if (!inside(p, stage)) continue;
      const room = clearance(p, items);
      if (room >= FREE_RADIUS_M) return tidyPoint(p);
      if (room > best.room) best = { p, room };
    }
  }
  return tidyPoint(best.p);
}

const tidyPoint = (p: Point): Point => ({ x: Math.round(p.x * 10) / 10, y: Math.round(p.y * 10) / 10 });

/** The direction a new item should face on the plan, degrees, or null to keep its kind's default. */
export function initialAim(kind: ItemKind, at: Point, items: readonly Item[]): number | null {
  const subject = items.find((i) => i.kind === 'subject');
  if ((kind === 'camera' || kind === 'light') && subject) return Math.round(angleTo(at, anchorOf(subject)));
  if (kind === 'subject') {
    const camera = items.find((i) => i.kind === 'camera');
    return camera ? Math.round(angleTo(at, anchorOf(camera))) : null;
  }
  return null;
}

/** How far in front of the subject a new camera stands, metres, nearest first tried last: a short tele's
 *  head-and-shoulders distance (common practice), shorter when the stage ends first. */
const CAMERA_DISTANCES_M = [3, 2.5, 2];

/**
 * Where a new camera stands when there is a subject: in front of it along its facing, at a working distance
 * (not 0.7 m beside it, where the free-spot search would put it), and at the height of its face; null when
 * there is no subject or no clear spot in front of it on the stage (then the free spot is used).
 */
export function cameraSpot(items: readonly Item[], stage: SetupDocument['stage']): { at: Point; heightM: number } | null {
  const subject = items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  if (!subject) return null;
  const d = direction(subject.facingDeg);
  for (const r of CAMERA_DISTANCES_M) {
    const p = tidyPoint({ x: subject.x + d.x * r, y: subject.y + d.y * r });
    if (inside(p, stage) && clearance(p, items) >= FREE_RADIUS_M) return { at: p, heightM: subject.faceHeightM };
  }
  return null;
}

