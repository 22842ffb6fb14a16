// The whole plan as one sketch: grid, light cones, light-map contours, every item, and a scale bar — what the
// crew sheet and the image exports print. The editor draws the same parts as separate layers.
import { GELS, MODIFIERS, type LightMapResult } from '../../calc';
import type { ItemOf, SetupDocument } from '../../model/document';
import { M_PER_FT, formatStops, type Units } from '../../model/units';
import type { PlanTheme } from '../views/style';
import { scaleBarLength } from '../viewport';
import { sketchItem } from './glyphs';
import { g, line, path, place, polyline, rect, text, type SvgNode } from './nodes';

/** The grid over the stage; `fill: 'none'` lets a tint drawn beneath show through (the editor's light map). */
export function sketchGrid(stage: SetupDocument['stage'], theme: PlanTheme, fill: string = theme.background): SvgNode {
  const lines: SvgNode[] = [];
  for (let k = 0; k * 0.5 <= stage.widthM + 1e-9; k++) {
    const x = k * 0.5;
    const major = k % 2 === 0;
    lines.push(line({ x1: x, y1: 0, x2: x, y2: stage.depthM, stroke: major ? theme.gridMajor : theme.gridMinor, strokeWidth: major ? 0.012 : 0.008 }));
  }
  for (let k = 0; k * 0.5 <= stage.depthM + 1e-9; k++) {
    const y = k * 0.5;
    const major = k % 2 === 0;
    lines.push(line({ x1: 0, y1: y, x2: stage.widthM, y2: y, stroke: major ? theme.gridMajor : theme.gridMinor, strokeWidth: major ? 0.012 : 0.008 }));
  }
  return g({}, rect({ x: 0, y: 0, width: stage.widthM, height: stage.depthM, fill, stroke: theme.gridMajor, strokeWidth: 0.02 }), ...lines);
}

const BEAM_REACH_M = 3;

/** A translucent fan as wide as the light's beam, tinted by its gel. */
export function sketchBeam(l: ItemOf<'light'>): SvgNode | null {
  if (!l.on) return null;
  const spec = MODIFIERS[l.modifier];
  const halfDeg = Math.min(80, l.gridDeg !== null ? Math.min(spec.halfAngleDeg, l.gridDeg / 2) : spec.halfAngleDeg);
  const h = (halfDeg * Math.PI) / 180;
  const ex = Math.cos(h) * BEAM_REACH_M;
  const ey = Math.sin(h) * BEAM_REACH_M;
  return g({ transform: place(l.x, l.y, l.aimDeg) }, path({ d: `M0,0 L${ex},${-ey} A${BEAM_REACH_M},${BEAM_REACH_M} 0 0 1 ${ex},${ey} Z`, fill: GELS[l.gel].tint, fillOpacity: 0.1 }));
}

/** One-stop contour lines of the light map, the subject's level drawn heavier, each level labelled once. */
export function sketchContours(map: LightMapResult, ink: string): SvgNode {
  return g(
    {},
    ...map.contours.flatMap((level) =>
      level.lines.map((pts, k) => {
        const mid = pts[Math.floor(pts.length / 2)];
        return g(
          {},
          polyline({ points: pts.map(([x, y]) => `${x},${y}`).join(' '), fill: 'none', stroke: ink, strokeWidth: level.stops === 0 ? 0.018 : 0.01, strokeOpacity: level.stops === 0 ? 0.8 : 0.45 }),
          mid && pts.length > 12 && k === 0 && text({ x: mid[0], y: mid[1], fontSize: 0.13, fill: ink, fillOpacity: 0.8, fontFamily: 'IBMPlexMono_400Regular', textAnchor: 'middle' }, formatStops(level.stops)),
        );
      }),
    ),
  );
}

/** A scale bar with a round length, drawn in plan metres at (x, y). */
export function sketchScaleBar(x: number, y: number, pxPerM: number, units: Units, ink: string): SvgNode {
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

/** The plan for print: the stage with a margin; `pxPerM` only chooses the scale bar's round length. */
export function sketchPlan(doc: SetupDocument, o: { theme: PlanTheme; units: Units; lightMap?: LightMapResult | null; pxPerM: number }): { root: SvgNode; viewBox: [number, number, number, number] } {
  const margin = 0.5;
  const lights = doc.items.filter((i): i is ItemOf<'light'> => i.kind === 'light');
  const root = g(
    {},
    sketchGrid(doc.stage, o.theme),
    o.lightMap ? sketchContours(o.lightMap, o.theme.ink) : null,
    ...lights.map(sketchBeam),
    ...doc.items.map((i) => sketchItem(i, { theme: o.theme, units: o.units })),
    sketchScaleBar(0.1, doc.stage.depthM + 0.3, o.pxPerM, o.units, o.theme.ink),
  );
  return { root, viewBox: [-margin, -margin, doc.stage.widthM + 2 * margin, doc.stage.depthM + 2 * margin] };
}
