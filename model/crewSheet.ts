// What a crew sheet says, as plain data: the kit list, camera settings, the meter's readings, steps, shot
// list and safety notes for one setup document. The server's PDF, the share page and the editor's preview
// all print this one structure, so paper and screen cannot disagree. Pure: no React, no I/O.
import { GELS, MODIFIERS } from '../calc';
import type { Item, ItemOf, SetupDocument } from './document';
import { sensorFormats } from './items/camera';
import { kinds } from './kinds';
import { computeReadings, type Readings } from './readings';
import { STANDING_CAUTIONS, planCautions } from './safety';
import { formatAperture, formatLength, formatPower, formatShutter, formatStops, type Units } from './units';

/** The line every crew sheet ends its safety notes with. */
export const DEFER_LINE = 'Local electrical and venue codes, the venue’s own rules and licensed practice come first; these notes do not replace them.';

export type KitLight = {
  id: string;
  name: string;
  /** "Strobe 500 Ws", "Speedlight GN 42", "LED 1000 lm, 5600 K" */
  source: string;
  modifier: string;
  gel: string | null;
  height: string;
  /** Where it points, in words the crew can rig from ("at Sitter, tilted 40° down"). */
  aim: string;
  /** The power as dialled on the head ("1/8", "1/4 −0.3"; a continuous lamp's dimmer as a percentage). */
  power: string;
  stand: string;
  on: boolean;
};
export type KitLine = { what: string; detail: string };
export type Reading = { label: string; value: string; detail?: string };
export type CrewSheet = {
  title: string;
  units: Units;
  lights: KitLight[];
  /** Stands, sandbags, shapers, backdrops and props, one line each. */
  gear: KitLine[];
  camera: Reading[];
  readings: Reading[];
  /** The meter's own warnings (sync, power out of range). */
  warnings: string[];
  steps: { n: number; title: string; note: string; adds: string[] }[];
  shots: { framing: string; lens: string; settings: string; note: string }[];
  safety: string[];
  /** The stage size as printed under the plan. */
  stage: string;
};

const nameOf = (i: Item) => i.label || `${kinds[i.kind].label} ${i.id}`;
const round = (n: number) => Math.round(n);

function sourceText(l: ItemOf<'light'>): string {
  const s = l.source;
  if (s.type === 'strobe') return `Strobe ${round(s.energyWs)} Ws`;
  if (s.type === 'speedlight') return `Speedlight GN ${round(s.guideNumberM)}`;
  const lamp = s.lamp === 'led' ? 'LED' : 'Tungsten';
  const out = s.lumens !== null ? `${round(s.lumens)} lm` : `${round(s.luxAt1m ?? 1000)} lx at 1 m`;
  return `${lamp} ${out}, ${round(s.kelvin)} K${s.watts ? `, ${round(s.watts)} W` : ''}`;
}

function powerText(l: ItemOf<'light'>): string {
  if (l.source.type === 'continuous') return `dimmer ${Math.round(l.power * 100)} %`;
  return formatPower(l.power);
}

function modifierText(l: ItemOf<'light'>): string {
  const m = MODIFIERS[l.modifier].label;
  return l.gridDeg !== null ? `${m} with ${round(l.gridDeg)}° grid` : m;
}

const standText: Record<ItemOf<'light'>['stand'], string> = { stand: 'light stand', boom: 'boom arm', floor: 'on the floor', handheld: 'hand-held' };

/** Aim in the crew's words: at the subject or how far it is feathered off it, and the tilt. */
function aimText(l: ItemOf<'light'>, subject: ItemOf<'subject'> | undefined, readings: Readings): string {
  const tilt = l.tiltDeg === 0 ? 'level' : `tilted ${Math.abs(round(l.tiltDeg))}° ${l.tiltDeg < 0 ? 'down' : 'up'}`;
  if (!subject) return tilt;
  const who = subject.label || 'the subject';
  const r = readings.meter?.lights.find((x) => x.id === l.id);
  // Off-axis angle from the meter (3-D); without a reading, the plan angle alone.
  const planOff = Math.abs(((((Math.atan2(subject.y - l.y, subject.x - l.x) * 180) / Math.PI - l.aimDeg) % 360) + 540) % 360 - 180);
  const off = r ? r.offAxisDeg : planOff;
  const where = off < 8 ? `at ${who}` : off > 100 ? `away from ${who}` : `feathered ${round(off)}° off ${who}`;
  return `${where}, ${tilt}`;
}

function lightsOf(doc: SetupDocument, units: Units, readings: Readings): KitLight[] {
  const subject = doc.items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  return doc.items
    .filter((i): i is ItemOf<'light'> => i.kind === 'light')
    .map((l) => ({
      id: l.id,
      name: nameOf(l),
      source: sourceText(l),
      modifier: modifierText(l),
      gel: l.gel === 'none' ? null : GELS[l.gel].label,
      height: formatLength(l.heightM, units),
      aim: aimText(l, subject, readings),
      power: powerText(l),
      stand: `${standText[l.stand]}${l.stand === 'stand' || l.stand === 'boom' ? (l.sandbagged ? ', sandbagged' : ', NO SANDBAG NOTED') : ''}`,
      on: l.on,
    }));
}

const size = (w: number, h: number, units: Units) => `${formatLength(w, units)} × ${formatLength(h, units)}`;

function gearOf(doc: SetupDocument, units: Units): KitLine[] {
  const out: KitLine[] = [];
  const lights = doc.items.filter((i): i is ItemOf<'light'> => i.kind === 'light');
  const stands = lights.filter((l) => l.stand === 'stand').length;
  const booms = lights.filter((l) => l.stand === 'boom').length;
  const panels = doc.items.filter((i) => i.kind === 'reflector' || i.kind === 'flag' || i.kind === 'scrim').length;
  const standParts = [stands && `${stands} light stand${stands > 1 ? 's' : ''}`, booms && `${booms} boom${booms > 1 ? 's' : ''}`, panels && `${panels} for shapers`].filter(Boolean);
  if (standParts.length) {
    out.push({ what: 'Stands', detail: standParts.join(', ') });
    // At least one sandbag per stand and two per boom, common practice.
    out.push({ what: 'Sandbags', detail: `at least ${stands + panels + booms * 2}` });
  }
  for (const i of doc.items) {
    switch (i.kind) {
      case 'reflector':
        out.push({ what: nameOf(i), detail: `${i.finish} reflector, ${size(i.widthM, i.heightM, units)}, lower edge at ${formatLength(i.baseM, units)}` });
        break;
      case 'flag':
        out.push({ what: nameOf(i), detail: `flag, ${size(i.widthM, i.heightM, units)}, lower edge at ${formatLength(i.baseM, units)}` });
        break;
      case 'vflat':
        out.push({ what: nameOf(i), detail: `v-flat, ${i.face} side to the set, ${size(i.widthM, i.heightM, units)}` });
        break;
      case 'scrim':
        out.push({ what: nameOf(i), detail: `scrim, ${size(i.widthM, i.heightM, units)}, about ${formatStops(-i.lossStops)} stops` });
        break;
      case 'wall':
        if (i.surface !== 'wall') {
          const len = Math.hypot(i.b.x - i.a.x, i.b.y - i.a.y);
          out.push({ what: nameOf(i), detail: `${i.surface === 'seamless' ? 'seamless paper' : 'curtain'} ${i.colour}, ${formatLength(len, units)} wide` });
        }
        break;
      case 'prop':
        out.push({ what: nameOf(i), detail: i.shape.replace('-', ' ') });
        break;
      default:
        break;
    }
  }
  return out;
}

function cameraOf(doc: SetupDocument, units: Units): Reading[] {
  const c = doc.items.find((i): i is ItemOf<'camera'> => i.kind === 'camera');
  if (!c) return [{ label: 'Camera', value: 'not drawn', detail: 'the meter assumes f/8 · 1/200 · ISO 100' }];
  return [
    { label: 'Exposure', value: `${formatAperture(c.aperture)} · ${formatShutter(c.shutterS)} · ISO ${c.iso}`, detail: c.ndStops ? `ND ${c.ndStops} stops` : undefined },
    { label: 'Lens', value: `${c.focalMm} mm`, detail: sensorFormats[c.sensor].label },
    { label: 'Camera height', value: formatLength(c.heightM, units) },
    { label: 'Flash sync', value: formatShutter(c.syncS) },
  ];
}

function readingsOf(doc: SetupDocument, readings: Readings): { rows: Reading[]; warnings: string[] } {
  const m = readings.meter;
  if (!m) {
    const why = readings.build.missing.length ? `add ${readings.build.missing.join(' and ')} to the plan` : (readings.error ?? 'no reading');
    return { rows: [{ label: 'Meter', value: '—', detail: why }], warnings: [] };
  }
  const names = new Map(doc.items.map((i) => [i.id, nameOf(i)]));
  const rows: Reading[] = [{ label: 'At the subject', value: formatAperture(m.subject.aperture), detail: `${formatStops(m.subject.stopsVsCamera)} stops vs the camera` }];
  for (const l of m.lights) {
    if (!l.enabled) continue;
    const set = l.forTarget.fraction !== null && doc.targetAperture !== null ? `; for ${formatAperture(m.targetAperture)} set ${formatPower(l.forTarget.fraction)}` : '';
    // Far under the exposure, an f-number (f/0.2) means nothing to the crew: say there is no useful light.
    const faint = l.stopsVsCamera !== null && l.stopsVsCamera < -8;
    if (faint) {
      rows.push({ label: names.get(l.id) ?? l.id, value: '—', detail: `alone, ${formatStops(l.stopsVsCamera)} stops: no useful light at the face${set}` });
      continue;
    }
    const alone = l.aperture === null ? (l.incidenceDeg >= 90 ? 'from behind: no reading at the face' : 'does not reach the subject') : `alone, ${formatStops(l.stopsVsCamera)} stops${set}`;
    rows.push({ label: names.get(l.id) ?? l.id, value: formatAperture(l.aperture), detail: alone });
  }
  if (m.keyFill.ratio !== null) rows.push({ label: 'Key : fill', value: `${m.keyFill.ratio.toFixed(1)}:1`, detail: `${m.keyFill.ratioStops!.toFixed(1)} stops` });
  if (m.background?.stopsVsSubject != null) rows.push({ label: 'Background', value: `${formatStops(m.background.stopsVsSubject)} stops`, detail: 'vs the subject' });
  if (m.ambient) rows.push({ label: 'Room light', value: `${formatStops(m.ambient.stopsVsCamera)} stops`, detail: 'vs the exposure' });
  const warnings = m.warnings.map((w) => (w.lightId && names.has(w.lightId) ? w.message.replace(w.lightId, names.get(w.lightId)!) : w.message));
  return { rows, warnings };
}

/** Everything a crew sheet prints for `doc`; pass `readings` when the caller has them already. */
export function crewSheet(doc: SetupDocument, o: { title: string; units: Units; readings?: Readings }): CrewSheet {
  const readings = o.readings ?? computeReadings(doc);
  const names = new Map(doc.items.map((i) => [i.id, nameOf(i)]));
  const { rows, warnings } = readingsOf(doc, readings);
  return {
    title: o.title,
    units: o.units,
    lights: lightsOf(doc, o.units, readings),
    gear: gearOf(doc, o.units),
    camera: cameraOf(doc, o.units),
    readings: rows,
    warnings,
    steps: doc.steps.map((s, k) => ({ n: k + 1, title: s.title || `Step ${k + 1}`, note: s.note, adds: s.itemIds.map((id) => names.get(id)).filter((x): x is string => !!x) })),
    shots: doc.shots.map((s) => ({
      framing: s.framing[0]!.toUpperCase() + s.framing.slice(1),
      lens: `${s.focalMm} mm`,
      settings: `${formatAperture(s.aperture)} · ${formatShutter(s.shutterS)} · ISO ${s.iso}`,
      note: s.note,
    })),
    // The standing list's own deferral is replaced by the fuller line that names the venue's rules.
    safety: [...planCautions(doc).map((c) => c.message), ...STANDING_CAUTIONS.filter((c) => !/\bcodes\b/i.test(c)), DEFER_LINE],
    stage: `Stage ${size(doc.stage.widthM, doc.stage.depthM, o.units)}`,
  };
}
