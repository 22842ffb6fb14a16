// Teaching from setups, the pure part: the check an assignment can carry (targets the meter can evaluate),
// `evaluateCheck` (run by the server when a plan is submitted and by the client before, the same code),
// and the plain-words change line a lesson shows as each step is placed.
//
// Both read the meter through `computeReadings` (model/setupReadings.ts), so a check or a change line can never
// disagree with the Meter panel.
import { z } from 'zod';
import type { MeterResult } from '../calc';
import type { Item, SetupDocument } from './document';
import { itemName } from './kinds';
import { computeReadings } from './setupReadings';
import { itemsAtStep } from './documentToScene';
import { formatAperture, formatStops } from './units';

// ---------------------------------------------------------------------------------------------
// The check

/** What a criterion measures, with the words the UI uses for it. */
export const checkMeasures = {
  /** The lights' total at the subject, stops over (+) or under (−) the camera's exposure. */
  subject: { label: 'Subject vs the camera', unit: 'stops' },
  /** The background behind the subject, stops relative to the subject (−2 = two stops darker). */
  background: { label: 'Background vs the subject', unit: 'stops' },
  /** Key:fill, the key's exposure over the fill's, as "x:1" (a fill light is needed; a reflector is not metered as one). */
  keyFill: { label: 'Key : fill', unit: 'ratio' },
  /** Lights that are switched on in the plan. */
  lights: { label: 'Lights on', unit: 'count' },
  /** The room's light alone, stops vs the camera's exposure (−3 = three stops under). */
  ambient: { label: 'Room light vs the camera', unit: 'stops' },
} as const;
export type CheckMeasure = keyof typeof checkMeasures;

/** A subject target may name the receptor it is read by (default: the setup's own). */
const receptorSchema = z.enum(['dome-camera', 'flat-light', 'flat-face'], { error: 'receptor is one of dome-camera, flat-light, flat-face' });
const RECEPTOR_WORDS = { 'dome-camera': 'a dome pointed at the camera', 'flat-light': 'a flat disc pointed at each light', 'flat-face': 'a flat disc along the face' } as const;

const stops = (what: string) => z.number({ error: `${what} in stops` }).finite().min(-20, 'at least −20').max(20, 'at most 20');
const bounds = <T extends z.ZodType<number>>(v: T) => ({ min: v.nullable().default(null), max: v.nullable().default(null) });

const criterionSchema = z.discriminatedUnion(
  'measure',
  [
    z.object({ measure: z.literal('subject'), ...bounds(stops('subject')), receptor: receptorSchema.optional() }).strict(),
    z.object({ measure: z.literal('background'), ...bounds(stops('background')) }).strict(),
    z.object({ measure: z.literal('keyFill'), ...bounds(z.number({ error: 'a ratio such as 3 for 3:1' }).finite().min(1, 'at least 1 (1:1)').max(256, 'at most 256')) }).strict(),
    z.object({ measure: z.literal('lights'), ...bounds(z.number({ error: 'a number of lights' }).int('a whole number').min(0).max(64)) }).strict(),
    z.object({ measure: z.literal('ambient'), ...bounds(stops('room light')) }).strict(),
  ],
  { error: 'measure is one of subject, background, keyFill, lights, ambient' },
);
export type Criterion = z.infer<typeof criterionSchema>;

export const checkSchema = z
  .object({ criteria: z.array(criterionSchema).min(1, 'add at least one target').max(10, 'at most 10 targets') })
  .strict()
  .superRefine((c, ctx) => {
    c.criteria.forEach((k, i) => {
      if (k.min === null && k.max === null) ctx.addIssue({ code: 'custom', path: ['criteria', i, 'min'], message: 'give a lowest value, a highest value or both' });
      else if (k.min !== null && k.max !== null && k.min > k.max) ctx.addIssue({ code: 'custom', path: ['criteria', i, 'max'], message: 'the highest value is below the lowest' });
    });
  });
export type Check = z.infer<typeof checkSchema>;

type CriterionResult = {
  measure: CheckMeasure;
  label: string;
  /** The target in words: "2.0 stops or more under the subject". */
  target: string;
  min: number | null;
  max: number | null;
  /** The value measured on the plan (stops, x of x:1, or a count); null when the meter has nothing to read. */
  measured: number | null;
  /** The measured value as the Meter panel shows it. */
  measuredText: string;
  pass: boolean;
  /** Why nothing was measured ("needs a key and a fill light"). */
  note: string | null;
};
export type CheckResult = { pass: boolean; criteria: CriterionResult[]; /** What the plan lacks for a reading ("a subject"). */ missing: string[] };

/**
 * Values are compared as the Meter panel shows them — stops and ratios to one decimal — so a plan that reads
 * "−2.0" passes "2.0 stops or more under" even if the unrounded value is −1.96.
 */
const shown = (v: number) => Math.round(v * 10) / 10;

function measure(c: Criterion, doc: SetupDocument, m: MeterResult | null): { value: number | null; note: string | null } {
  switch (c.measure) {
    case 'lights':
      return { value: itemsAtStep(doc).filter((i) => i.kind === 'light' && i.on).length, note: null };
    case 'subject': {
      if (m?.subject.stopsVsCamera == null) return { value: null, note: 'no light reaches the subject' };
      if (!c.receptor || c.receptor === m.receptor) return { value: m.subject.stopsVsCamera, note: null };
      // The same light read by another receptor: shift by the ratio of the two readings.
      const by = m.subjectByReceptor;
      return by[c.receptor] > 0 && by[m.receptor] > 0
        ? { value: m.subject.stopsVsCamera + Math.log2(by[c.receptor] / by[m.receptor]), note: null }
        : { value: null, note: `no light on ${RECEPTOR_WORDS[c.receptor]}` };
    }
    case 'background':
      if (!m?.background) return { value: null, note: 'no wall or backdrop behind the subject' };
      return m.background.stopsVsSubject != null ? { value: m.background.stopsVsSubject, note: null } : { value: null, note: 'no light on the subject or the background' };
    case 'keyFill':
      return m?.keyFill.ratio != null ? { value: m.keyFill.ratio, note: null } : { value: null, note: 'needs a key and a fill light' };
    case 'ambient':
      return m?.ambient ? { value: m.ambient.stopsVsCamera, note: null } : { value: null, note: 'the plan has no room light metered' };
  }
}

const ratioText = (r: number) => `${shown(r).toFixed(1)}:1`;
function valueText(c: CheckMeasure, v: number | null): string {
  if (v === null) return '—';
  if (c === 'keyFill') return ratioText(v);
  if (c === 'lights') return String(v);
  return `${formatStops(v)} stops`;
}

/** A criterion's target in plain words. */
export function describeTarget(c: Criterion): string {
  const { min, max } = c;
  if (c.measure === 'lights') {
    const n = (k: number) => `${k} light${k === 1 ? '' : 's'}`;
    if (min !== null && max !== null) return min === max ? `exactly ${n(min)}` : `${min} to ${n(max)}`;
    return min !== null ? `at least ${n(min)}` : `at most ${n(max!)}`;
  }
  if (c.measure === 'keyFill') {
    if (min !== null && max !== null) return `between ${ratioText(min)} and ${ratioText(max)}`;
    return min !== null ? `${ratioText(min)} or more` : `${ratioText(max!)} or less`;
  }
  const ref = c.measure === 'background' ? 'the subject' : c.measure === 'subject' && c.receptor ? `the camera, read by ${RECEPTOR_WORDS[c.receptor]}` : 'the camera';
  const s = (v: number) => `${Math.abs(v).toFixed(1)} stop${Math.abs(v) === 1 ? '' : 's'}`;
  if (min !== null && max !== null) return `between ${formatStops(min)} and ${formatStops(max)} stops vs ${ref}`;
  if (max !== null) return max <= 0 ? `${s(max)} or more under ${ref}` : `at most ${s(max)} over ${ref}`;
  return min! >= 0 ? `${s(min!)} or more over ${ref}` : `no more than ${s(min!)} under ${ref}`;
}

/** Evaluate an assignment's check on a plan (the whole plan, every step placed). */
export function evaluateCheck(check: Check, doc: SetupDocument): CheckResult {
  const r = computeReadings(doc);
  const criteria = check.criteria.map((c): CriterionResult => {
    const { value, note } = measure(c, doc, r.meter);
    const v = value === null ? null : c.measure === 'lights' ? value : shown(value);
    const pass = v !== null && (c.min === null || v >= c.min) && (c.max === null || v <= c.max);
    return { measure: c.measure, label: checkMeasures[c.measure].label, target: describeTarget(c), min: c.min, max: c.max, measured: value, measuredText: valueText(c.measure, value), pass, note };
  });
  return { pass: criteria.every((c) => c.pass), criteria, missing: r.build.missing };
}

// ---------------------------------------------------------------------------------------------
// The change line

/** A change smaller than this (stops) reads as "unchanged": below what a meter's display shows. */
const UNCHANGED_STOPS = 0.05;

// How an item is named in a sentence lives with the kinds (the read-only link's comments use it without this
// module's schemas).
export { itemName };

function listNames(items: Item[]): string {
  const names = items.map(itemName);
  if (names.length <= 1) return names[0] ?? '';
  if (names.length > 3) return `${names.slice(0, 2).join(', ')} and ${names.length - 2} more`;
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** What shapes the light is named; the rest of a first step (room, sitter, camera, notes) is "the set". */
const shapesLight = (i: Item) => i.kind === 'light' || i.kind === 'reflector' || i.kind === 'flag' || i.kind === 'vflat' || i.kind === 'scrim';
function leadNames(items: Item[], first: boolean): string {
  const named = items.filter(shapesLight);
  if (!first || named.length === 0 || named.length === items.length) return listNames(items);
  return `${listNames(named)} and the set`;
}

/**
 * Light more than this far under the camera's exposure (stops) counts as none: it records as black, far
 * below what any sensor holds detail in (common practice), and "+19 stops" would say nothing useful.
 */
const DARK_STOPS = -8;
const lit = (p: { stopsVsCamera: number | null }) => p.stopsVsCamera !== null && p.stopsVsCamera > DARK_STOPS;

/** "+0.3 stop", "−2.0 stops", "unchanged". */
export function stopsChangeText(d: number): string {
  if (Math.abs(d) < UNCHANGED_STOPS) return 'unchanged';
  const r = Math.abs(shown(d));
  return `${d > 0 ? '+' : '−'}${r.toFixed(1)} ${r > 1 ? 'stops' : 'stop'}`;
}

export type ChangeInput = {
  /** Items the step places. */
  added: Item[];
  /** The meter at the step before (null at the first step, or when nothing could be metered). */
  before: MeterResult | null;
  after: MeterResult | null;
  /** What the plan lacks for a reading after the step ("a subject"). */
  missingAfter: string[];
  first: boolean;
  /**
   * Which side of the camera's line through the subject each light stands on, against the key: a kicker on the
   * far side from the key lights the face's shadow side (from the plan; absent = not said).
   */
  sides?: Record<string, 'key side' | 'shadow side'>;
};

/**
 * One sentence on what a step did to the light: "adding Rim left: +0.3 stop on the subject, background
 * unchanged". Light on the subject and on the background is compared as exposure (lux·s), so the line says
 * what the new item added, whatever the camera is set to.
 */
export function describeChange({ added, before, after, missingAfter, first, sides }: ChangeInput): string {
  const lead = added.length === 0 ? 'this step places nothing new' : `${first ? 'starting with' : 'adding'} ${leadNames(added, first)}`;
  if (!after) return missingAfter.length ? `${lead}: nothing to meter yet (needs ${missingAfter.join(' and ')})` : `${lead}: the meter cannot read the plan here`;
  const amb = after.ambient;
  const room = amb && amb.stopsVsCamera < 0 ? `room light ${Math.abs(shown(amb.stopsVsCamera)).toFixed(1)} stops under` : amb ? 'room light will show' : null;
  // No light drawn yet: only the room's light can be read.
  if (missingAfter.length) return `${lead}: nothing to meter yet (needs ${missingAfter.join(' and ')})${room ? `, ${room}` : ''}`;
  const parts: string[] = [];

  const subj = after.subject;
  const subjBefore = before && lit(before.subject) ? before.subject : null;
  if (!lit(subj)) parts.push(subjBefore ? 'the subject goes dark' : 'no light on the subject yet');
  else if (!subjBefore) parts.push(`the subject reads ${formatAperture(subj.aperture)} (${formatStops(subj.stopsVsCamera)} vs the camera)`);
  else parts.push(`${stopsChangeText(Math.log2(subj.luxSeconds / subjBefore.luxSeconds))} on the subject`);

  const bg = after.background;
  const bgBefore = before?.background && lit(before.background) ? before.background : null;
  if (bg && lit(bg)) {
    if (bgBefore) parts.push(`background ${stopsChangeText(Math.log2(bg.luxSeconds / bgBefore.luxSeconds))}`);
    else if (bg.stopsVsSubject !== null && lit(subj)) parts.push(`background ${formatStops(bg.stopsVsSubject)} vs the subject`);
    else parts.push(`background ${formatStops(bg.stopsVsCamera)} vs the camera`);
  } else if (bgBefore) parts.push('the background goes dark');

  // Rims, hair lights and kickers the step adds: their level against the key, read pointed at each light.
  for (const item of added) {
    const l = after.lights.find((x) => x.id === item.id);
    if (!l?.enabled || !l.vsKey || l.vsKey.stops === null) continue;
    const v = l.vsKey.stops;
    const side = sides?.[l.id] ? ` on the ${sides[l.id]}` : '';
    const words = Math.abs(v) < UNCHANGED_STOPS ? 'level with the key' : v > 0 ? `${stopsChangeText(v)} over the key` : `${stopsChangeText(-v).slice(1)} under the key`;
    parts.push(`${added.length > 1 ? `${itemName(item)} ` : ''}${words}${side}`);
  }

  const kf = after.keyFill;
  const kfBefore = before?.keyFill.ratio ?? null;
  if (kf.ratio !== null && (kfBefore === null || Math.abs(Math.log2(kf.ratio / kfBefore)) >= 0.1)) parts.push(`key:fill now ${ratioText(kf.ratio)}`);

  if (room && (!before?.ambient || Math.abs(amb!.stopsVsCamera - before.ambient.stopsVsCamera) >= 0.1)) parts.push(room);
  return `${lead}: ${parts.join(', ')}`;
}

/** The change line for step `stepIndex` (0-based) of a document, from the meter at the step before and this one. */
export function stepChangeLine(doc: SetupDocument, stepIndex: number): string {
  if (!doc.steps[stepIndex]) return '';
  // "Before the first step" is the plan of the items in no step (itemsAtStep at −1).
  const earlier = new Set(itemsAtStep(doc, stepIndex - 1).map((i) => i.id));
  const added = itemsAtStep(doc, stepIndex).filter((i) => !earlier.has(i.id));
  const after = computeReadings(doc, { stepIndex });
  const before = computeReadings(doc, { stepIndex: stepIndex - 1 }).meter;
  return describeChange({ added, before, after: after.meter, missingAfter: after.build.missing, first: stepIndex === 0, sides: lightSides(doc, stepIndex, after.meter) });
}

/** Each light's side of the camera's line through the subject, against the key's (plan positions at the step). */
function lightSides(doc: SetupDocument, stepIndex: number, m: MeterResult | null): Record<string, 'key side' | 'shadow side'> {
  const items = itemsAtStep(doc, stepIndex);
  const cam = items.find((i) => i.kind === 'camera');
  const sub = items.find((i) => i.kind === 'subject');
  const key = m?.keyFill.keyId ? items.find((i) => i.id === m.keyFill.keyId) : undefined;
  if (!cam || !sub || !key || key.kind !== 'light' || cam.kind !== 'camera' || sub.kind !== 'subject') return {};
  const dx = sub.x - cam.x;
  const dy = sub.y - cam.y;
  const sideOf = (x: number, y: number) => Math.sign(dx * (y - sub.y) - dy * (x - sub.x));
  const k = sideOf(key.x, key.y);
  const out: Record<string, 'key side' | 'shadow side'> = {};
  if (k === 0) return out;
  for (const i of items) {
    if (i.kind !== 'light' || i.id === key.id) continue;
    const s = sideOf(i.x, i.y);
    if (s !== 0) out[i.id] = s === k ? 'key side' : 'shadow side';
  }
  return out;
}
