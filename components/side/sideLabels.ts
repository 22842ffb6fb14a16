// The side view's labels, placed like the plan's (drawing/labels.ts) in the view's own pixels: at least 11 px,
// each at the first spot around its head clear of the other labels and the heads, the selected item first,
// then the subject, the camera and the lights; the ones with no room left off. The view's own marks — the
// ceiling's height and the whole-metre heights on the scale — come last: each tries the left end of its line,
// then the right, and gives way to the heads (a head's label matters more than the scale behind it).
import { around, placeSpecs, type Box, type LabelSpec, type PlacedLabel } from '../../drawing/labels';
import { formatLength, type Units } from '../../model/units';
import { sideTransform, tiltHandle, type SideBox, type SideScene } from './elevation';

export const SIDE_LABEL_PX = 11;

/** A placed side-view label: a head's (`head`), the ceiling's or a height on the scale (`scale`). */
export type SideLabel = PlacedLabel & { role: 'head' | 'ceiling' | 'scale' };

/** The words a shape carries in the side view. */
function sideWords(sh: SideScene['shapes'][number], units: Units): string | null {
  switch (sh.kind) {
    case 'subject':
    case 'camera':
      return `${sh.label} · ${formatLength(sh.at.z, units, 2)}`;
    case 'light':
      return `${sh.label} · ${formatLength(sh.at.z, units, 2)} · ${sh.tiltDeg > 0 ? '+' : sh.tiltDeg < 0 ? '−' : ''}${Math.abs(sh.tiltDeg)}°`;
    default:
      return null;
  }
}

/** The whole-metre heights the scale names (under the view's top). */
export function scaleHeights(scene: Pick<SideScene, 'z1'>): number[] {
  const out: number[] = [];
  for (let z = 1; z < scene.z1 - 1e-6; z += 1) out.push(z);
  return out;
}

/** Labels for the side view drawn in `box` (pixels), heads first. */
export function sideLabels(scene: SideScene, box: SideBox, units: Units, selection: readonly string[]): SideLabel[] {
  const t = sideTransform(scene, box);
  const specs: LabelSpec[] = [];
  const keepOff: Box[] = [];
  const role = new Map<string, SideLabel['role']>();
  scene.shapes.forEach((sh, k) => {
    const words = sideWords(sh, units);
    if (!words || sh.kind === 'wall' || sh.kind === 'panel') return;
    const c = t.toPx(sh.at);
    const r = sh.kind === 'subject' ? Math.max(5, 0.11 * t.scale) : sh.kind === 'camera' ? 10 : 9;
    // The tilt ring is a handle: labels keep off it too.
    if (sh.kind !== 'subject') {
      const h = t.toPx(tiltHandle(sh.at, sh.tiltDeg, sh.facing));
      keepOff.push({ cx: h.x, cy: h.y, hw: 8, hh: 8 });
    }
    const rank = selection.includes(sh.id) ? 0 : sh.kind === 'subject' ? 1 : sh.kind === 'camera' ? 2 : 3;
    // Beams and fields of view point along the line, at the tilt: try the side away from them first.
    const awayDeg = sh.kind === 'subject' ? undefined : (sh.facing === 1 ? 0 : 180) - sh.tiltDeg * sh.facing;
    specs.push({ id: sh.id, text: words, priority: rank + k / 1000, mono: false, spots: around({ x: c.x, y: c.y }, r + 2, awayDeg), body: { cx: c.x, cy: c.y, hw: r, hh: r } });
    role.set(sh.id, 'head');
  });
  // The view's own marks sit just above their line, at the left end or else the right.
  const left = t.toPx({ u: scene.u0, z: 0 }).x;
  const right = t.toPx({ u: scene.u1, z: 0 }).x;
  const onLine = (id: string, text: string, z: number, priority: number, rightFirst: boolean) => {
    const y = t.toPx({ u: 0, z }).y;
    const l = { at: { x: left, y }, dir: { x: 1, y: -1 } };
    const r = { at: { x: right, y }, dir: { x: -1, y: -1 } };
    specs.push({ id, text, priority, mono: true, spots: rightFirst ? [r, l] : [l, r], body: null });
  };
  if (scene.ceiling !== null && scene.ceiling <= scene.z1) {
    onLine('ceiling', `ceiling ${formatLength(scene.ceiling, units, 1)}`, scene.ceiling, 10, true);
    role.set('ceiling', 'ceiling');
  }
  for (const z of scaleHeights(scene)) {
    onLine(`scale-${z}`, formatLength(z, units, 0), z, 11 + z / 100, false);
    role.set(`scale-${z}`, 'scale');
  }
  const placed = placeSpecs(specs, { fontM: SIDE_LABEL_PX, gap: 2, bounds: { x0: 0, y0: 0, x1: box.w, y1: box.h }, keepOff });
  return placed.map((p) => ({ ...p, role: role.get(p.id) ?? 'head' }));
}
