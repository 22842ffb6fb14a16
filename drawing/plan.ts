// The whole plan as one sketch: grid, light cones, light-map contours, every item, and a scale bar — what the
// crew sheet and the image exports print. The editor draws the same parts as separate layers.
import { GELS, MODIFIERS, type LightMapResult } from '../calc';
import type { Item, ItemOf, SetupDocument } from '../model/document';
import { M_PER_FT, formatStops, type Units } from '../model/units';
import type { PlanTheme } from './theme';
import { scaleBarLength } from './scaleBar';
import { sketchItem } from './glyphs';
import { placeContourLabels } from './contourLabels';
import { itemBodies, labelBounds, placeLabels, sketchLabels, type PlacedLabel } from './labels';
import { g, line, path, place, polyline, rect, text, type SvgNode } from './nodes';

/** The grid over the stage; `fill: 'none'` lets a tint drawn beneath show through (the editor's light map). */
/** The finest grid step drawn (metres): finer snapping steps (zoomed far in) still draw 5 cm lines, so an 8 m stage
 *  never has more than 160 lines a side. */
const GRID_DRAW_MIN_M = 0.05;

/**
 * The stage and its grid: lines every `stepM` (0.5 m by default, as the exports print it; the editor passes the
 * step its drags snap to), heavier on whole metres — or on every line when the step is a metre or more.
 */
export function sketchGrid(stage: SetupDocument['stage'], theme: PlanTheme, fill: string = theme.background, stepM = 0.5, majorM = 1): SvgNode {
  // A fine snapping step is drawn every few steps (lines on snap positions all the same), at least GRID_DRAW_MIN_M apart.
  const step = stepM * Math.max(1, Math.ceil(GRID_DRAW_MIN_M / stepM - 1e-9));
  const lines: SvgNode[] = [];
  // Heavier on whole metres (or whole feet: `majorM`).
  const majorAt = (v: number) => step >= majorM - 1e-9 || Math.abs(v / majorM - Math.round(v / majorM)) < 1e-6;
  const along = (len: number, draw: (v: number, major: boolean) => SvgNode) => {
    for (let k = 0; k * step <= len + 1e-9; k++) {
      const v = Math.round(k * step * 10000) / 10000;
      lines.push(draw(v, majorAt(v)));
    }
  };
  const ink = (major: boolean) => ({ stroke: major ? theme.gridMajor : theme.gridMinor, strokeWidth: major ? 0.012 : 0.008 });
  along(stage.widthM, (x, major) => line({ x1: x, y1: 0, x2: x, y2: stage.depthM, ...ink(major) }));
  along(stage.depthM, (y, major) => line({ x1: 0, y1: y, x2: stage.widthM, y2: y, ...ink(major) }));
  return g({}, rect({ x: 0, y: 0, width: stage.widthM, height: stage.depthM, fill, stroke: theme.gridMajor, strokeWidth: 0.02 }), ...lines);
}

const BEAM_REACH_M = 3;

/** What stops a drawn beam: the walls, and the stage's edge. */
export type BeamClip = { walls: readonly { a: { x: number; y: number }; b: { x: number; y: number } }[]; stage: { widthM: number; depthM: number } };

/** How far a ray from (ox, oy) along (dx, dy) travels before it meets a wall or leaves the stage, up to `max`. */
export function rayReach(ox: number, oy: number, dx: number, dy: number, max: number, clip: BeamClip): number {
  let t = max;
  // The stage's edge (a light standing off the stage is not clipped by it).
  const { widthM: w, depthM: h } = clip.stage;
  if (ox >= 0 && ox <= w && oy >= 0 && oy <= h) {
    if (dx > 1e-12) t = Math.min(t, (w - ox) / dx);
    if (dx < -1e-12) t = Math.min(t, -ox / dx);
    if (dy > 1e-12) t = Math.min(t, (h - oy) / dy);
    if (dy < -1e-12) t = Math.min(t, -oy / dy);
  }
  for (const { a, b } of clip.walls) {
    const ex = b.x - a.x;
    const ey = b.y - a.y;
    const den = dx * ey - dy * ex;
    if (Math.abs(den) < 1e-12) continue;
    const wx = a.x - ox;
    const wy = a.y - oy;
    const along = (wx * ey - wy * ex) / den;
    const on = (wx * dy - wy * dx) / den;
    if (along > 1e-6 && on >= 0 && on <= 1) t = Math.min(t, along);
  }
  return Math.max(0, t);
}

const BEAM_RAYS = 33;
/** A beam whose plan view is shorter than this (a light aimed within about 4° of straight up or down) draws no fan. */
const MIN_BEAM_REACH_M = 0.2;

/** A translucent fan as wide as the light's beam, tinted by its gel; with `clip`, cut short at walls and the
 *  stage's edge (a fan of rays, each stopped where it first meets one). */
export function sketchBeam(l: ItemOf<'light'>, clip?: BeamClip): SvgNode | null {
  if (!l.on) return null;
  const spec = MODIFIERS[l.modifier];
  const halfDeg = Math.min(80, l.gridDeg !== null ? Math.min(spec.halfAngleDeg, l.gridDeg / 2) : spec.halfAngleDeg);
  const h = (halfDeg * Math.PI) / 180;
  // Seen from above, a beam tilted up or down reaches less far across the floor: the fan is the plan's view of
  // the beam (its reach × cos tilt), so a flash turned straight up to bounce draws no fan across the set.
  const reach = BEAM_REACH_M * Math.cos((l.tiltDeg * Math.PI) / 180);
  if (reach < MIN_BEAM_REACH_M) return null;
  if (!clip) {
    const ex = Math.cos(h) * reach;
    const ey = Math.sin(h) * reach;
    return g({ transform: place(l.x, l.y, l.aimDeg) }, path({ d: `M0,0 L${ex},${-ey} A${reach},${reach} 0 0 1 ${ex},${ey} Z`, fill: GELS[l.gel].tint, fillOpacity: 0.1 }));
  }
  const aim = (l.aimDeg * Math.PI) / 180;
  const pts: string[] = [];
  for (let k = 0; k < BEAM_RAYS; k++) {
    const a = aim - h + (2 * h * k) / (BEAM_RAYS - 1);
    const dx = Math.cos(a);
    const dy = Math.sin(a);
    const t = rayReach(l.x, l.y, dx, dy, reach, clip);
    pts.push(`${Math.round((l.x + dx * t) * 1000) / 1000},${Math.round((l.y + dy * t) * 1000) / 1000}`);
  }
  return path({ d: `M${l.x},${l.y} L${pts.join(' L')} Z`, fill: GELS[l.gel].tint, fillOpacity: 0.1 });
}

/** The walls and stage of a document, as a beam's clip. */
export function beamClipOf(doc: Pick<SetupDocument, 'items' | 'stage'>): BeamClip {
  return { walls: doc.items.filter((i): i is ItemOf<'wall'> => i.kind === 'wall'), stage: doc.stage };
}

/** One-stop contour lines of the light map, the subject's level drawn heavier; at most one label a level, at
 *  `pxPerM`'s label size, where the line is long and straight, clear of the lights, the items and their labels
 *  (`itemLabels`, placed first). */
export function sketchContours(map: LightMapResult, ink: string, o: ContourLabelOptions): SvgNode {
  return g(
    {},
    ...map.contours.flatMap((level) =>
      level.lines.map((pts) =>
        polyline({ points: pts.map(([x, y]) => `${x},${y}`).join(' '), fill: 'none', stroke: ink, strokeWidth: level.stops === 0 ? 0.018 : 0.01, strokeOpacity: level.stops === 0 ? 0.8 : 0.45 }),
      ),
    ),
    ...contourLabelNodes(map, ink, o),
  );
}

type ContourLabelOptions = { pxPerM: number; items: readonly Item[]; itemLabels: readonly PlacedLabel[]; units: Units };

/** The contour levels' labels, at most one a level, clear of the lights, the items and their labels. */
export function contourLabelNodes(map: LightMapResult, ink: string, o: ContourLabelOptions): SvgNode[] {
  const lights = o.items.filter((i) => i.kind === 'light') as ItemOf<'light'>[];
  const labels = placeContourLabels(map.contours, { pxPerM: o.pxPerM, lights, avoid: [...itemBodies(o.items, o.units), ...o.itemLabels.map((l) => l.box)], format: formatStops });
  return labels.map((l) => g({ transform: place(l.x, l.y, l.angleDeg) }, text({ x: 0, y: l.fontM * 0.35, fontSize: l.fontM, fill: ink, fillOpacity: 0.85, fontFamily: 'IBMPlexMono_400Regular', textAnchor: 'middle' }, l.text)));
}

/** A scale bar with a round length, drawn in plan metres at (x, y). */
function sketchScaleBar(x: number, y: number, pxPerM: number, units: Units, ink: string): SvgNode {
  const unitM = units === 'metric' ? 1 : M_PER_FT;
  const n = scaleBarLength(pxPerM, unitM, 120);
  const len = n * unitM;
  const s = { stroke: ink, strokeWidth: 0.02 };
  return g(
    { transform: place(x, y) },
    line({ x1: 0, y1: 0, x2: len, y2: 0, ...s }),
    line({ x1: 0, y1: -0.08, x2: 0, y2: 0, ...s }),
    line({ x1: len, y1: -0.08, x2: len, y2: 0, ...s }),
    text({ x: len + 0.08, y: 0.03, fontSize: 0.14, fill: ink, fontFamily: 'IBMPlexMono_400Regular' }, `${n} ${units === 'metric' ? 'm' : 'ft'}`),
  );
}

/** The plan for print: the stage with a margin; `pxPerM` is the drawing's nominal scale: it chooses the scale
 *  bar's round length, and labels are placed at LABEL_PX at that scale (drawing/labels.ts), as on screen. */
export function sketchPlan(doc: SetupDocument, o: { theme: PlanTheme; units: Units; lightMap?: LightMapResult | null; pxPerM: number }): { root: SvgNode; viewBox: [number, number, number, number] } {
  const margin = 0.5;
  const lights = doc.items.filter((i): i is ItemOf<'light'> => i.kind === 'light');
  const labels = placeLabels(doc.items, { pxPerM: o.pxPerM, units: o.units, bounds: labelBounds(doc.stage, margin) });
  const root = g(
    {},
    sketchGrid(doc.stage, o.theme),
    o.lightMap ? sketchContours(o.lightMap, o.theme.ink, { pxPerM: o.pxPerM, items: doc.items, itemLabels: labels, units: o.units }) : null,
    ...lights.map((l) => sketchBeam(l, beamClipOf(doc))),
    ...doc.items.map((i) => sketchItem(i, { theme: o.theme, units: o.units })),
    sketchLabels(labels, o.theme),
    sketchScaleBar(0.1, doc.stage.depthM + 0.3, o.pxPerM, o.units, o.theme.ink),
  );
  return { root, viewBox: [-margin, -margin, doc.stage.widthM + 2 * margin, doc.stage.depthM + 2 * margin] };
}
