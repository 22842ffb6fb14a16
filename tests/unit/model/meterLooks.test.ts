// The closing note's table: an everyday two-light look (a gelled wash on the wall behind a seated sitter and a
// gridded kicker from behind) and the three demo setups, each light read by every receptor — "before" is the flat
// disc along the face, the only receptor the meter had — and the background's range per channel. Writes
// tests/.artifacts/meter-looks.md. Scenes are our own invented plans.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createLightMapCache, lightMap, meter, meterParsed, parseScene, type LightMapResult, type MeterResult, type SceneInput } from '../../../calc';
import { demoSetups } from '../../../db/seed-setups';
import { sceneFromDocument } from '../../../model/documentToScene';
import { mapGridFor } from '../../../model/setupReadings';
import { formatAperture, formatStops } from '../../../model/units';

/** The look: a seated sitter 1.5 m from a pale grey wall, a full-CTO wash on the wall, a 20° grid kicker from behind. */
const look: SceneInput = {
  lights: [
    { id: 'key', kind: 'flash', x: 3.2, y: 1.6, heightM: 1.9, aimDeg: 200, tiltDeg: -20, output: { type: 'energy', ratedWs: 400 }, powerFraction: 1 / 8, modifier: 'octa', role: 'key' },
    { id: 'wash', kind: 'flash', x: 1.4, y: 3.4, heightM: 0.6, aimDeg: 190, tiltDeg: 10, output: { type: 'energy', ratedWs: 200 }, powerFraction: 1 / 16, modifier: 'bare-reflector', gel: 'full-cto', role: 'background' },
    { id: 'kicker', kind: 'flash', x: 1.2, y: 3.0, heightM: 1.5, aimDeg: 328, tiltDeg: -18, output: { type: 'energy', ratedWs: 200 }, powerFraction: 1 / 8, modifier: 'grid-20', role: 'kicker' },
  ],
  surfaces: [{ id: 'wall', x1: 0.5, y1: 0, x2: 0.5, y2: 5, topM: 2.8, colour: '#c8c4bc' }],
  floor: { x1: 0, y1: 0, x2: 5, y2: 5, colour: '#6b5a48' },
  ceiling: { heightM: 2.8, colour: '#f0f0f0' },
  subject: { x: 2, y: 2.5, heightM: 1.2, facingDeg: 0 },
  camera: { x: 4.6, y: 2.5, heightM: 1.2, aimDeg: 180, aperture: 8, shutterS: 1 / 200, iso: 100, focalMm: 85 },
  options: { receptor: 'dome-camera' },
};

const cell = (h: number | null | undefined, ref: number | null): string => {
  if (h === null || h === undefined || !(h > 1e-20) || ref === null) return '— (no light)';
  const stops = Math.log2(h / ref);
  return stops < -12 ? '— (black)' : `${formatStops(stops)}`;
};
const tone = (t: { stops: (number | null)[]; clipped: boolean; blocked: boolean }) =>
  `R ${formatStops(t.stops[0] ?? null)} · G ${formatStops(t.stops[1] ?? null)} · B ${formatStops(t.stops[2] ?? null)}${t.clipped ? ' (clips)' : t.blocked ? ' (black)' : ''}`;

function table(title: string, m: MeterResult): string {
  // Stops vs the camera's correct exposure: H_correct = H_subject / 2^stopsVsCamera.
  const correct = m.subject.stopsVsCamera !== null ? m.subject.luxSeconds / Math.pow(2, m.subject.stopsVsCamera) : null;
  const rows = m.lights.map(
    (l) =>
      `| ${l.id} | ${l.role} | ${cell(l.byReceptor['flat-face'], correct)} | ${cell(l.byReceptor['dome-camera'], correct)} | ${cell(l.byReceptor['flat-light'], correct)} | ${l.vsKey ? `${formatStops(l.vsKey.stops)} (want ${formatStops(l.vsKey.targetStops)})` : l.backgroundTone ? tone(l.backgroundTone) : formatAperture(l.aperture)} |`,
  );
  const bg = m.background;
  const lines = [
    `### ${title}`,
    '',
    `Exposure receptor: ${m.receptor}. Subject ${formatAperture(m.subject.aperture)} (${formatStops(m.subject.stopsVsCamera)} vs the camera); by receptor: flat along the face ${cell(m.subjectByReceptor['flat-face'], correct)}, dome ${cell(m.subjectByReceptor['dome-camera'], correct)}, pointed at each light ${cell(m.subjectByReceptor['flat-light'], correct)} stops vs the camera.`,
    '',
    '| light | role | before: flat along the face | dome to the camera | flat pointed at the light | advice (vs key, or tone on the background) |',
    '|---|---|---|---|---|---|',
    ...rows,
    '',
    bg
      ? `Background (${bg.surfaceId ?? 'point'}): ${formatStops(bg.stopsVsSubject)} stops vs the subject; recorded ${tone(bg.recorded)} vs mid-grey` +
        (bg.range ? `; across the frame (${bg.range.samples} samples) brightest ${tone(bg.range.brightest)}, darkest ${tone(bg.range.darkest)}.` : '.')
      : 'Background: none behind the subject.',
    '',
    `Warnings: ${m.warnings.length ? m.warnings.map((w) => w.message).join('; ') : 'none'}.`,
    '',
  ];
  return lines.join('\n');
}

describe('the closing-note table of readings', () => {
  it('reads the kicker and the wash the way a photographer meters them, and writes the table', () => {
    const m = meter(look);
    const kick = m.lights.find((l) => l.id === 'kicker')!;
    const wash = m.lights.find((l) => l.id === 'wash')!;
    // Before: the flat disc along the face saw nothing of a light from behind. Now the pointed disc reads it against the key.
    expect(meter({ ...look, options: { receptor: 'flat-face' } }).lights.find((l) => l.id === 'kicker')!.byReceptor['flat-face']).toBeLessThan(kick.byReceptor['flat-light'] / 16);
    expect(kick.vsKey?.stops).not.toBeNull();
    // The wash is judged by the tone it gives the wall, with no "above full power" for a light whose job is not the face.
    expect(wash.backgroundTone).not.toBeNull();
    expect(m.warnings.some((w) => w.code === 'beyond-full-power' && w.lightId !== 'key')).toBe(false);
    // Full CTO: the red channel over the blue on the wall.
    expect(wash.backgroundTone!.stops[0]!).toBeGreaterThan(wash.backgroundTone!.stops[2]!);

    const parts = [
      '# Meter readings by receptor: an everyday look and the demo setups',
      '',
      'Each light alone at the subject, in stops vs the camera\'s exposure, by each receptor. "Before" is the flat disc',
      'along the face, the only receptor the meter had before (its readings are unchanged when a scene names it). Written by',
      'tests/unit/model/meterLooks.test.ts.',
      '',
      table('Gelled wall wash behind a seated sitter, gridded kicker from behind (and an octa key)', m),
    ];
    for (const d of demoSetups) {
      const b = sceneFromDocument(d.document);
      expect(b.scene).toBeTruthy();
      parts.push(table(`Demo: ${d.title}`, meter(b.scene!)));
    }
    mkdirSync(join(process.cwd(), 'tests', '.artifacts'), { recursive: true });
    writeFileSync(join(process.cwd(), 'tests', '.artifacts', 'meter-looks.md'), parts.join('\n'));
  });
});

/** The map's exposure at a plan point, bilinear between its grid points. */
function mapAt(map: LightMapResult, x: number, y: number): number {
  const fi = (x - map.x0) / map.dxM;
  const fj = (y - map.y0) / map.dyM;
  const i = Math.min(map.nx - 2, Math.max(0, Math.floor(fi)));
  const j = Math.min(map.ny - 2, Math.max(0, Math.floor(fj)));
  const fx = fi - i;
  const fy = fj - j;
  const v = map.luxSeconds;
  const n = map.nx;
  return (v[j * n + i]! * (1 - fx) + v[j * n + i + 1]! * fx) * (1 - fy) + (v[(j + 1) * n + i]! * (1 - fx) + v[(j + 1) * n + i + 1]! * fx) * fy;
}

describe('the light map agrees with the meter', () => {
  const cases: [string, SceneInput, { widthM: number; depthM: number }][] = [
    ['gelled wash + kicker', look, { widthM: 5, depthM: 5 }],
    ['gelled wash + kicker, flat along the face', { ...look, options: { receptor: 'flat-face' } }, { widthM: 5, depthM: 5 }],
    ...demoSetups.map((d) => [`demo: ${d.title}`, sceneFromDocument(d.document).scene!, d.document.stage] as [string, SceneInput, { widthM: number; depthM: number }]),
  ];
  it.each(cases)('%s: the map at the subject reads the meter within 0.1 stop', (_name, input, stage) => {
    const scene = parseScene(input);
    const m = meterParsed(scene);
    const map = createLightMapCache().updateParsed(scene, mapGridFor(stage as never));
    expect(map.reference).toBe('subject');
    expect(map.referenceLuxSeconds).toBeCloseTo(m.subject.luxSeconds, 9);
    // The grid's own values (direct, bounce interpolated from the coarse grid) at the subject, against the meter's reading.
    expect(Math.abs(Math.log2(mapAt(map, scene.subject.x, scene.subject.y) / m.subject.luxSeconds))).toBeLessThan(0.1);
  });

  it('the subject casts its shadow on the map, and the wall tone is the meter\'s recorded tone', () => {
    // A bare head 1 m in front of the sitter at face height throws the body's shadow straight back.
    const base: SceneInput = {
      ...look,
      lights: [{ id: 'key', kind: 'flash', x: 3, y: 2.5, heightM: 1.2, aimDeg: 180, output: { type: 'energy', ratedWs: 400 }, powerFraction: 1 / 8, modifier: 'bare-reflector', role: 'key' }],
      options: { receptor: 'dome-camera' },
    };
    const withBody: SceneInput = { ...base, subject: { ...base.subject, body: { widthM: 0.45, depthM: 0.25, topM: 1.32 } } };
    const grid = { x0: 0.6, y0: 0.1, x1: 4.9, y1: 4.9, nx: 44, ny: 49 };
    const lit = lightMap(base, grid);
    const shaded = lightMap(withBody, grid);
    // 0.5 m behind the subject on the light's line: in the shadow (only bounce), at least 3 stops darker.
    const behind = (map: LightMapResult) => mapAt(map, 1.5, 2.5);
    expect(Math.log2(behind(shaded) / behind(lit))).toBeLessThan(-3);
    // 1.1 m to the side of the shadow, the same direct light (the body takes a little of the bounce there).
    expect(Math.abs(Math.log2(mapAt(shaded, 1.5, 3.6) / mapAt(lit, 1.5, 3.6)))).toBeLessThan(0.4);
    // The wall strip: the shadow is on the wall too, and its tones are the meter's recorded tones (background beside it).
    const wall = shaded.walls.find((w) => w.surfaceId === 'wall')!;
    expect(wall.samples.length).toBeGreaterThan(10);
    const lum = (t: { stops: (number | null)[] }) => Math.log2(0.2126 * 2 ** (t.stops[0] ?? -99) + 0.7152 * 2 ** (t.stops[1] ?? -99) + 0.0722 * 2 ** (t.stops[2] ?? -99));
    const mid = wall.samples[Math.floor(wall.samples.length / 2)]!;
    const edge = wall.samples[Math.floor(wall.samples.length * 0.2)]!;
    expect(lum(mid)).toBeLessThan(lum(edge) - 2);
    const m = meter(withBody);
    // The meter's darkest point across the frame (in the shadow, beside the silhouette) and the strip's sample nearest it agree within 0.15 stop.
    const p = m.background!.range!.darkest.point;
    const k = Math.round(((p.y - wall.y1) / (wall.y2 - wall.y1)) * wall.samples.length - 0.5);
    expect(Math.abs(lum(wall.samples[k]!) - lum(m.background!.range!.darkest))).toBeLessThan(0.15);
    // The light is nearer the sitter than the camera: the shadow is wider than the sitter, so the lens sees it beside them.
    expect(m.background!.recorded.blocked).toBe(true);
  });

  it('the wall wash shows its gel on the wall: full CTO records red over blue near the light', () => {
    const map = lightMap(look, { x0: 0.6, y0: 0.1, x1: 4.9, y1: 4.9, nx: 44, ny: 49 });
    const wall = map.walls.find((w) => w.surfaceId === 'wall')!;
    const hot = wall.samples.reduce((a, b) => ((b.stops[0] ?? -99) > (a.stops[0] ?? -99) ? b : a));
    expect(hot.stops[0]!).toBeGreaterThan(hot.stops[2]! + 0.5);
    expect(hot.hex).toMatch(/^#[0-9a-f]{6}$/);
  });
});
