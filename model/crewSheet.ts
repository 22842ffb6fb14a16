// What a crew sheet says, as plain data: the kit list, camera settings, the meter's readings, steps, shot
// list and safety notes for one setup document. The server's PDF, the share page and the editor's preview
// all print this one structure, so paper and screen cannot disagree. Pure: no React, no I/O.
import { GELS, MODIFIERS, type MeterResult } from '../calc';
import type { Item, ItemOf, SetupDocument } from './document';
import { sensorFormats } from './items/camera';
import { itemNames, kindOf, kinds, warningText } from './kinds';
import { computeReadings, type Readings } from './setupReadings';
import { STANDING_CAUTIONS, planCautions } from './safety';
import { formatAperture, formatLength, formatPower, formatShutter, formatStops, type Units } from './units';

/** The line every crew sheet ends its safety notes with. */
export const DEFER_LINE = 'Local electrical and venue codes, the venue’s own rules and licensed practice come first; these notes do not replace them.';

type KitLight = {
  id: string;
  name: string;
  /** "Strobe 500 Ws", "Speedlight GN 42", "LED 1000 lm, 5600 K" */
  source: string;
  modifier: string;
  gel: string | null;
  height: string;
  /** Where it points, in words the crew can rig from ("toward Sitter, tilted 40° down", "25° off Sitter, level"). */
  aim: string;
  /** Centre of the head to the subject's face, straight line, in the account's units; null without a subject. */
  toSubject: string | null;
  /** Centre of the head to the background point the meter reads (where the camera's line meets the backdrop); null without one. */
  toBackground: string | null;
  /** A flash's expected meter reading at the subject from this light alone ("f/8.0"); null for a continuous lamp or no reading. */
  expected: string | null;
  /** The power as dialled on the head ("1/8", "1/4 −0.3"; a continuous lamp's dimmer as a percentage). */
  power: string;
  stand: string;
  on: boolean;
};
type KitLine = { what: string; detail: string };
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
  /** The setup's notes, as written. */
  notes: string;
  /** Rigging in step order: what to place and set, then the checks before the first flash. */
  checklist: ChecklistRow[];
};
type ChecklistRow = { step: string | null; text: string };

const nameOf = (doc: SetupDocument, i: Item) => itemNames(doc.items).get(i.id) ?? (i.label || kinds[i.kind].label);
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
  const where = off < 8 ? `toward ${who}` : off > 100 ? `away from ${who}` : `${round(off)}° off ${who}`;
  return `${where}, ${tilt}`;
}

function lightsOf(doc: SetupDocument, units: Units, readings: Readings): KitLight[] {
  const subject = doc.items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  const bg = readings.meter?.background?.point ?? null;
  const dist = (l: ItemOf<'light'>, p: { x: number; y: number; z: number }) => formatLength(Math.hypot(p.x - l.x, p.y - l.y, p.z - l.heightM), units, 1);
  const expected = (l: ItemOf<'light'>) => {
    if (l.source.type === 'continuous') return null;
    const r = readings.meter?.lights.find((x) => x.id === l.id);
    return r && r.enabled && r.aperture !== null && !(r.stopsVsCamera !== null && r.stopsVsCamera < -8) ? formatAperture(r.aperture) : null;
  };
  return doc.items
    .filter((i): i is ItemOf<'light'> => i.kind === 'light')
    .map((l) => ({
      toSubject: subject ? dist(l, { x: subject.x, y: subject.y, z: subject.faceHeightM }) : null,
      toBackground: bg ? dist(l, bg) : null,
      expected: expected(l),
      id: l.id,
      name: nameOf(doc, l),
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
  // Each kind writes its own line (model/items/); lights have their own table above.
  for (const i of doc.items) {
    const detail = kindOf(i).gear?.(i, units);
    if (detail) out.push({ what: nameOf(doc, i), detail });
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

/** How the exposure reading was taken, in the sheet's words. */
const RECEPTOR_WORDS: Record<MeterResult['receptor'], string> = {
  'dome-camera': 'dome at the face pointed at the camera',
  'flat-light': 'flat disc pointed at each light',
  'flat-face': 'flat disc along the face',
};

function readingsOf(doc: SetupDocument, readings: Readings): { rows: Reading[]; warnings: string[] } {
  const m = readings.meter;
  if (!m) {
    const why = readings.build.missing.length ? `add ${readings.build.missing.join(' and ')} to the plan` : (readings.error ?? 'no reading');
    return { rows: [{ label: 'Meter', value: '—', detail: why }], warnings: [] };
  }
  const names = itemNames(doc.items);
  const rows: Reading[] = [{ label: 'At the subject', value: formatAperture(m.subject.aperture), detail: `${formatStops(m.subject.stopsVsCamera)} stops vs the camera, ${RECEPTOR_WORDS[m.receptor]}` }];
  for (const l of m.lights) {
    if (!l.enabled) continue;
    const name = names.get(l.id) ?? l.id;
    // Rims, hair lights and kickers are set against the key, read with the meter pointed at each light.
    if (l.vsKey) {
      const v = l.vsKey;
      const change = v.fraction !== null && v.stopsChange !== null && Math.abs(v.stopsChange) >= 0.05
        ? v.beyondFull ? `; over full power by ${Math.log2(v.fraction).toFixed(1)} stops for ${formatStops(v.targetStops)}` : `; for ${formatStops(v.targetStops)} set ${formatPower(v.fraction)}`
        : '';
      // With no key in the look (a kicker alone on the face), its level is still read: pointed at it, against
      // the camera — never a blank for a light that lights the face.
      rows.push(
        v.stops === null
          ? { label: name, value: formatAperture(l.pointed.aperture), detail: l.pointed.stopsVsCamera === null ? 'no light pointed at it; no key to compare with' : `pointed at the light, ${formatStops(l.pointed.stopsVsCamera)} stops vs the camera; no key to compare with` }
          : { label: name, value: `${formatStops(v.stops)} vs key`, detail: `pointed at the light, ${formatAperture(l.pointed.aperture)}; wanted ${formatStops(v.targetStops)}${change}` },
      );
      continue;
    }
    // Background lights: the tone the camera records on the background, per channel.
    if (l.backgroundTone) {
      const t = l.backgroundTone;
      const top = Math.max(...t.stops.map((x) => x ?? -Infinity));
      rows.push({
        label: name,
        value: Number.isFinite(top) ? `${formatStops(top)} vs grey` : '—',
        detail: `on the background, R ${formatStops(t.stops[0])} · G ${formatStops(t.stops[1])} · B ${formatStops(t.stops[2])} vs mid-grey${t.clipped ? ': clips' : t.blocked ? ': black' : ''}`,
      });
      continue;
    }
    const set = l.forTarget.fraction !== null && doc.targetAperture !== null ? `; for ${formatAperture(m.targetAperture)} set ${formatPower(l.forTarget.fraction)}` : '';
    // Far under the exposure, an f-number (f/0.2) means nothing to the crew: say there is no useful light.
    const faint = l.stopsVsCamera !== null && l.stopsVsCamera < -8;
    if (faint) {
      rows.push({ label: name, value: '—', detail: `alone, ${formatStops(l.stopsVsCamera)} stops: no useful light at the face${set}` });
      continue;
    }
    const alone = l.aperture === null ? (l.incidenceDeg >= 90 ? 'from behind: no reading at the face' : 'does not reach the subject') : `alone, ${formatStops(l.stopsVsCamera)} stops${set}`;
    rows.push({ label: name, value: formatAperture(l.aperture), detail: alone });
  }
  if (m.keyFill.ratio !== null) {
    // Panels on the fill side (a card under the chin) return the key: say which.
    const panels = m.keyFill.fillPanels.panelIds.map((id) => names.get(id) ?? 'a panel');
    rows.push({ label: 'Key : fill', value: `${m.keyFill.ratio.toFixed(1)}:1`, detail: `${m.keyFill.ratioStops!.toFixed(1)} stops${panels.length > 0 ? `; fill side with the key off ${panels.join(', ')}` : ''}` });
  }
  if (m.background?.stopsVsSubject != null) {
    const bg = m.background;
    const top = (t: { stops: (number | null)[] }) => Math.max(...t.stops.map((x) => x ?? -Infinity));
    const range = bg.range ? `; across the frame ${formatStops(top(bg.range.darkest))} to ${formatStops(top(bg.range.brightest))} vs mid-grey` : '';
    rows.push({ label: 'Background', value: `${formatStops(bg.stopsVsSubject)} stops`, detail: `vs the subject${range}` });
  }
  if (m.ambient) rows.push({ label: 'Room light', value: `${formatStops(m.ambient.stopsVsCamera)} stops`, detail: 'vs the exposure' });
  const warnings = m.warnings.map((w) => warningText(w, names));
  return { rows, warnings };
}

/**
 * Rigging in the order the set is built: what stands from the start (items in no step: room and backdrops,
 * then subject, camera, lights, shapers), then each step's items; each light with its height, power and
 * aim; then the checks before the first flash (common practice).
 */
function checklistOf(doc: SetupDocument, lights: KitLight[], rows: Reading[]): ChecklistRow[] {
  const order: Record<Item['kind'], number> = { wall: 0, subject: 1, prop: 2, camera: 3, light: 4, reflector: 5, flag: 5, vflat: 5, scrim: 5, note: 9, tape: 9, arrow: 9 };
  const inStep = new Map<string, number>();
  doc.steps.forEach((st, k) => st.itemIds.forEach((id) => inStep.has(id) || inStep.set(id, k)));
  const byId = new Map(lights.map((l) => [l.id, l]));
  const line = (i: Item): string | null => {
    if (i.kind === 'note' || i.kind === 'tape' || i.kind === 'arrow') return null;
    const l = byId.get(i.id);
    if (l) return `Rig ${l.name}: ${l.modifier}${l.gel ? `, ${l.gel} gel` : ''}, height ${l.height}, ${l.aim}; dial ${l.power}${l.on ? '' : ' (leave it off)'}`;
    if (i.kind === 'wall') return i.surface === 'wall' ? null : `Hang ${nameOf(doc, i)}`;
    if (i.kind === 'camera') return `Set the camera at its mark: ${nameOf(doc, i)}`;
    if (i.kind === 'subject') return `Mark the subject’s place: ${nameOf(doc, i)}`;
    return `Place ${nameOf(doc, i)}`;
  };
  const out: ChecklistRow[] = [];
  const start = doc.items.filter((i) => !inStep.has(i.id)).sort((a, b) => order[a.kind] - order[b.kind]);
  for (const i of start) {
    const t = line(i);
    if (t) out.push({ step: null, text: t });
  }
  doc.steps.forEach((st, k) => {
    const items = doc.items.filter((i) => inStep.get(i.id) === k);
    for (const i of items) {
      const t = line(i);
      if (t) out.push({ step: `${k + 1}. ${st.title || `Step ${k + 1}`}`, text: t });
    }
  });
  const stands = lights.some((l) => /stand|boom/.test(l.stand));
  if (stands) out.push({ step: null, text: 'Sandbag every stand and boom; tape down the cables' });
  const subject = rows[0];
  out.push({ step: null, text: `Test-fire and meter at the subject: expect ${subject && subject.value !== '—' ? subject.value : 'the reading on the plan'}` });
  out.push({ step: null, text: 'Warn the subject before the flashes fire' });
  return out;
}

/** Everything a crew sheet prints for `doc`; pass `readings` when the caller has them already. */
export function crewSheet(doc: SetupDocument, o: { title: string; units: Units; readings?: Readings; notes?: string }): CrewSheet {
  const readings = o.readings ?? computeReadings(doc);
  const names = itemNames(doc.items);
  const { rows, warnings } = readingsOf(doc, readings);
  const lights = lightsOf(doc, o.units, readings);
  return {
    title: o.title,
    units: o.units,
    notes: o.notes?.trim() ?? '',
    checklist: checklistOf(doc, lights, rows),
    lights,
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
