// Falloff's own plan glyphs, drawn from geometry, one function per item kind. Each returns a sketch in plan
// metres; the canvas and the exports render the same sketch. Labels are not part of a glyph: they are placed
// as a layer of their own at a size fixed on screen (labels.ts), clear of each other.
import { GELS, MODIFIERS } from '../calc';
import type { Item, ItemKind, ItemOf } from '../model/document';
import { sensorFormats } from '../model/items/camera';
import { SHAPER_SURFACES, panelEnds } from '../model/items/shaper';
import type { Units } from '../model/units';
import { STROKE, THIN, type PlanTheme } from './theme';
import { circle, ellipse, g, line, path, place, polygon, rect, type SvgNode } from './nodes';

export type SketchContext = { theme: PlanTheme; units: Units };

const deg = (r: number) => (r * 180) / Math.PI;
const rad = (d: number) => (d * Math.PI) / 180;

/** A subject seen from above: shoulders, head, and a nose mark showing where the face points. */
function subject(i: ItemOf<'subject'>, { theme }: SketchContext) {
  return g(
    { transform: place(i.x, i.y) },
    g(
      { transform: `rotate(${i.facingDeg})` },
      ellipse({ cx: 0, cy: 0, rx: 0.12, ry: 0.25, fill: theme.subject, fillOpacity: 0.35, stroke: theme.subject, strokeWidth: STROKE }),
      circle({ cx: 0.02, cy: 0, r: 0.11, fill: theme.subject }),
      polygon({ points: '0.12,-0.05 0.2,0 0.12,0.05', fill: theme.subject }),
    ),
  );
}

const propShapes: Record<ItemOf<'prop'>['shape'], (c: string) => SvgNode[]> = {
  stool: (c) => [circle({ r: 0.17, fill: 'none', stroke: c, strokeWidth: STROKE })],
  chair: (c) => [rect({ x: -0.22, y: -0.22, width: 0.44, height: 0.44, rx: 0.05, fill: 'none', stroke: c, strokeWidth: STROKE }), line({ x1: -0.22, y1: -0.22, x2: -0.22, y2: 0.22, stroke: c, strokeWidth: STROKE * 3 })],
  'apple-box': (c) => [rect({ x: -0.25, y: -0.15, width: 0.5, height: 0.3, fill: 'none', stroke: c, strokeWidth: STROKE }), line({ x1: -0.1, y1: 0, x2: 0.1, y2: 0, stroke: c, strokeWidth: STROKE })],
  table: (c) => [rect({ x: -0.6, y: -0.4, width: 1.2, height: 0.8, rx: 0.04, fill: 'none', stroke: c, strokeWidth: STROKE })],
};

function prop(i: ItemOf<'prop'>, { theme }: SketchContext) {
  return g({ transform: place(i.x, i.y) }, g({ transform: `rotate(${i.rotationDeg})` }, ...propShapes[i.shape](theme.inkDim)));
}

/** The camera: a body, a lens along its aim, and its horizontal field of view as a wedge. */
function camera(i: ItemOf<'camera'>, { theme }: SketchContext) {
  const half = Math.atan(sensorFormats[i.sensor].widthMm / (2 * i.focalMm));
  const reach = 4;
  const ex = Math.cos(half) * reach;
  const ey = Math.sin(half) * reach;
  return g(
    { transform: place(i.x, i.y) },
    g(
      { transform: `rotate(${i.aimDeg})` },
      path({ d: `M0,0 L${ex},${-ey} A${reach},${reach} 0 0 1 ${ex},${ey} Z`, fill: theme.camera, fillOpacity: 0.07 }),
      line({ x1: 0, y1: 0, x2: ex, y2: -ey, stroke: theme.camera, strokeWidth: THIN, strokeDasharray: '0.08,0.06' }),
      line({ x1: 0, y1: 0, x2: ex, y2: ey, stroke: theme.camera, strokeWidth: THIN, strokeDasharray: '0.08,0.06' }),
      rect({ x: -0.16, y: -0.13, width: 0.22, height: 0.26, rx: 0.03, fill: theme.camera }),
      rect({ x: 0.06, y: -0.07, width: 0.12, height: 0.14, fill: theme.camera, fillOpacity: 0.8 }),
    ),
  );
}

/** The modifier's face, ahead of the head along the aim (x axis), to scale where it has a size. */
function modifierFace(l: ItemOf<'light'>, c: string): SvgNode[] {
  const spec = MODIFIERS[l.modifier];
  const w = Math.max(0.18, spec.faceRadiusM * 2);
  const stroke = { stroke: c, strokeWidth: STROKE, fill: 'none' };
  switch (l.modifier) {
    case 'softbox':
    case 'diffusion':
      return [path({ d: `M0.1,-0.08 L0.35,${-w / 2} L0.35,${w / 2} L0.1,0.08`, ...stroke })];
    case 'strip':
      return [path({ d: 'M0.1,-0.06 L0.3,-0.15 L0.3,0.15 L0.1,0.06', ...stroke, strokeWidth: STROKE * 1.5 })];
    case 'octa': {
      const pts = Array.from({ length: 8 }, (_, k) => {
        const a = rad(22.5 + k * 45);
        return `${0.35 + Math.cos(a) * 0.08},${Math.sin(a) * (w / 2)}`;
      }).join(' ');
      return [line({ x1: 0.1, y1: 0, x2: 0.3, y2: 0, stroke: c, strokeWidth: STROKE }), polygon({ points: pts, ...stroke })];
    }
    case 'beauty-dish':
      return [path({ d: `M0.28,${-w / 2} Q0.05,0 0.28,${w / 2}`, ...stroke, strokeWidth: STROKE * 1.5 })];
    case 'umbrella-reflective':
      return [path({ d: `M-0.15,${-w / 2} Q0.15,0 -0.15,${w / 2}`, ...stroke })];
    case 'umbrella-shoot-through':
      return [path({ d: `M0.45,${-w / 2} Q0.15,0 0.45,${w / 2}`, ...stroke, strokeDasharray: '0.05,0.03' })];
    case 'snoot':
      return [path({ d: 'M0.1,-0.06 L0.32,-0.03 L0.32,0.03 L0.1,0.06', ...stroke })];
    case 'barn-doors':
      return [line({ x1: 0.12, y1: -0.09, x2: 0.26, y2: -0.2, stroke: c, strokeWidth: STROKE }), line({ x1: 0.12, y1: 0.09, x2: 0.26, y2: 0.2, stroke: c, strokeWidth: STROKE })];
    case 'grid-10':
    case 'grid-20':
    case 'grid-30':
    case 'grid-40':
      return [rect({ x: 0.12, y: -0.09, width: 0.08, height: 0.18, ...stroke }), line({ x1: 0.16, y1: -0.09, x2: 0.16, y2: 0.09, stroke: c, strokeWidth: THIN })];
    default:
      return [path({ d: 'M0.1,-0.09 L0.2,-0.13 L0.2,0.13 L0.1,0.09', ...stroke })];
  }
}

/** A gel's colour as the light's ink: its tint, unless that is white or too pale to see on the theme
 *  (colour-correction gels are "white" in the table; on paper a pale tint would vanish). */
export function lightInk(gel: keyof typeof GELS, theme: PlanTheme): string {
  const tint = GELS[gel].tint;
  if (gel === 'none' || tint.toLowerCase() === '#ffffff') return theme.light;
  const [r, g, b] = [1, 3, 5].map((k) => parseInt(tint.slice(k, k + 2), 16) / 255);
  const bright = 0.2126 * r! + 0.7152 * g! + 0.0722 * b!; // Rec. 709 weights, on the encoded values: a rough lightness
  const paper = theme.background.toLowerCase() === '#ffffff';
  return paper && bright > 0.75 ? theme.light : tint;
}

/** A light from above: a disc for a flash head (a square for a continuous lamp) and its modifier's face. */
function light(i: ItemOf<'light'>, { theme }: SketchContext) {
  const tint = lightInk(i.gel, theme);
  const head =
    i.source.type === 'continuous'
      ? rect({ x: -0.12, y: -0.12, width: 0.24, height: 0.24, rx: 0.03, fill: theme.background, stroke: tint, strokeWidth: STROKE * 1.5 })
      : circle({ r: 0.12, fill: theme.background, stroke: tint, strokeWidth: STROKE * 1.5 });
  return g(
    { transform: place(i.x, i.y), opacity: i.on ? undefined : 0.4 },
    g(
      { transform: `rotate(${i.aimDeg})` },
      head,
      circle({ r: 0.045, fill: tint }),
      ...modifierFace(i, tint),
      i.gridDeg !== null && line({ x1: 0.33, y1: -0.12, x2: 0.33, y2: 0.12, stroke: tint, strokeWidth: THIN, strokeDasharray: '0.02,0.02' }),
    ),
  );
}

/** Reflectors, flags, v-flats and scrims are upright panels, drawn as their edge seen from above. */
function panel(i: ItemOf<'reflector'> | ItemOf<'flag'> | ItemOf<'vflat'> | ItemOf<'scrim'>, { theme }: SketchContext) {
  const { a, b } = panelEnds(i);
  const n = { x: Math.cos(rad(i.rotationDeg)), y: Math.sin(rad(i.rotationDeg)) };
  let body: SvgNode[];
  if (i.kind === 'reflector') {
    const c = SHAPER_SURFACES[i.finish].colour;
    const f = 0.06;
    body = [
      line({ x1: a.x, y1: a.y, x2: b.x, y2: b.y, stroke: c, strokeWidth: 0.06, strokeLinecap: 'round' }),
      path({ d: `M${a.x + n.x * f},${a.y + n.y * f} Q${i.x + n.x * 0.2},${i.y + n.y * 0.2} ${b.x + n.x * f},${b.y + n.y * f}`, stroke: c, strokeWidth: THIN, fill: 'none' }),
    ];
  } else if (i.kind === 'flag') {
    body = [line({ x1: a.x, y1: a.y, x2: b.x, y2: b.y, stroke: theme.flag, strokeWidth: 0.08, strokeLinecap: 'square' })];
  } else if (i.kind === 'vflat') {
    // Two boards hinged in a shallow V that opens towards the working face.
    const [front, back] = i.face === 'white' ? [SHAPER_SURFACES.white.colour, SHAPER_SURFACES.black.colour] : [SHAPER_SURFACES.black.colour, SHAPER_SURFACES.white.colour];
    const h = { x: i.x - n.x * 0.15, y: i.y - n.y * 0.15 };
    const o = 0.04;
    body = [
      path({ d: `M${a.x},${a.y} L${h.x},${h.y} L${b.x},${b.y}`, stroke: back, strokeWidth: 0.07, fill: 'none', strokeLinejoin: 'round' }),
      path({ d: `M${a.x + n.x * o},${a.y + n.y * o} L${h.x + n.x * o},${h.y + n.y * o} L${b.x + n.x * o},${b.y + n.y * o}`, stroke: front, strokeWidth: 0.025, fill: 'none' }),
    ];
  } else {
    body = [line({ x1: a.x, y1: a.y, x2: b.x, y2: b.y, stroke: theme.ink, strokeWidth: 0.05, strokeDasharray: '0.06,0.04', strokeOpacity: 0.7 })];
  }
  return g({}, ...body);
}

function wall(i: ItemOf<'wall'>, { theme }: SketchContext) {
  return g(
    {},
    line({ x1: i.a.x, y1: i.a.y, x2: i.b.x, y2: i.b.y, stroke: i.colour, strokeWidth: i.surface === 'seamless' ? 0.1 : 0.14, strokeLinecap: 'square' }),
    i.surface === 'seamless' && line({ x1: i.a.x, y1: i.a.y, x2: i.b.x, y2: i.b.y, stroke: theme.inkDim, strokeWidth: THIN, strokeDasharray: '0.1,0.08' }),
  );
}

function note(i: ItemOf<'note'>, { theme }: SketchContext) {
  return g(
    { transform: place(i.x, i.y) },
    rect({ x: -0.05, y: -0.05, width: 0.1, height: 0.1, fill: theme.selection }),
  );
}

/** A distance tape: the measured length between its ends, in the user's units. */
function tape(i: ItemOf<'tape'>, { theme }: SketchContext) {
  const len = Math.hypot(i.b.x - i.a.x, i.b.y - i.a.y);
  const ang = deg(Math.atan2(i.b.y - i.a.y, i.b.x - i.a.x));
  const s = { stroke: theme.inkDim, strokeWidth: THIN };
  return g(
    {},
    g({ transform: place(i.a.x, i.a.y, ang) }, line({ x1: 0, y1: 0, x2: len, y2: 0, ...s }), line({ x1: 0, y1: -0.08, x2: 0, y2: 0.08, ...s }), line({ x1: len, y1: -0.08, x2: len, y2: 0.08, ...s })),
  );
}

function arrow(i: ItemOf<'arrow'>, { theme }: SketchContext) {
  const len = Math.hypot(i.b.x - i.a.x, i.b.y - i.a.y);
  const ang = deg(Math.atan2(i.b.y - i.a.y, i.b.x - i.a.x));
  return g(
    { transform: place(i.a.x, i.a.y, ang) },
    line({ x1: 0, y1: 0, x2: Math.max(0, len - 0.12), y2: 0, stroke: theme.ink, strokeWidth: STROKE }),
    polygon({ points: `${len},0 ${len - 0.16},-0.07 ${len - 0.16},0.07`, fill: theme.ink }),
  );
}

/** Kind → sketch: the one place that knows how each kind of item looks. */
export const sketches: { [K in ItemKind]: (item: ItemOf<K>, c: SketchContext) => SvgNode } = {
  subject,
  prop,
  camera,
  light,
  reflector: panel,
  flag: panel,
  vflat: panel,
  scrim: panel,
  wall,
  note,
  tape,
  arrow,
};

export function sketchItem(item: Item, c: SketchContext): SvgNode {
  return (sketches[item.kind] as (i: Item, c: SketchContext) => SvgNode)(item, c);
}
