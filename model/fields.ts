// The inspector's field descriptions: what each kind lets the user change, as plain data and pure functions.
// Each kind's module lists its fields; components/editor/Inspector.tsx renders them. A field reads its value
// from the item it shows and turns an edit into a patch of that item (applied by the editor's updateItem
// action to the item as it is in the store when the edit lands).
import { formatAperture, lengthText, parseLength, parseNumber, unitSuffix, type Units } from './units';

export type Patch = Record<string, unknown>;
export type Option = { id: string; label: string; swatch?: string };

type Common<T> = {
  /** Shown only when this is true for the item. */
  when?: (item: T) => boolean;
};

/** What a field's accepted range may depend on: the plan's stage (positions stay on it). */
export type FieldContext = { stage: { widthM: number; depthM: number } };
/** The values a number field accepts, inclusive, in the stored unit (metres, seconds, a fraction of full power…). */
export type Range = { min: number; max: number };

export type NumberFieldSpec<T> = Common<T> & {
  type: 'number';
  /** What the field accepts; a value outside it is refused with a message naming this range. */
  range: Range | ((ctx: FieldContext) => Range);
  /** An empty field is a value of its own (−1, "not set"), not an error. */
  blankOk?: boolean;
  label: string | ((units: Units) => string);
  get: (item: T) => number;
  set: (v: number, item: T) => Patch;
  format: (v: number, units: Units) => string;
  parse: (text: string, units: Units) => number | null;
  /** The steppers (−/+): the patch for one step; none when the field has no steppers. */
  step?: (item: T, dir: -1 | 1, ctx: FieldContext) => Patch;
  testID?: string;
};
export type ChoiceFieldSpec<T> = Common<T> & {
  type: 'choice';
  label: string;
  get: (item: T) => string;
  options: readonly Option[];
  set: (v: string, item: T) => Patch;
};
export type SwitchFieldSpec<T> = Common<T> & { type: 'switch'; label: string; get: (item: T) => boolean; set: (v: boolean, item: T) => Patch };
export type TextFieldSpec<T> = Common<T> & { type: 'text'; label: string; get: (item: T) => string; set: (v: string, item: T) => Patch; multiline?: boolean };
/** A titled box of fields (a light's meter reading). */
export type SectionSpec<T> = Common<T> & { type: 'section'; label: string; fields: readonly FieldSpec<T>[] };

/**
 * A real meter reading of one light fired alone: the f-number the meter showed at an ISO, at a distance from
 * the light; the shutter for a continuous light; the light's power when read (null: its power now).
 */
export type MeterReading = { aperture: number; iso: number; distanceM: number; shutterS: number | null; power: number | null };
/**
 * A light's meter reading as a form: typed in full and confirmed before anything changes, or cleared (null).
 * `needsShutter`: the reading of a continuous light depends on the shutter it was taken at.
 */
export type ReadingFieldSpec<T> = Common<T> & {
  type: 'reading';
  label: string;
  get: (item: T) => MeterReading | null;
  set: (v: MeterReading | null, item: T) => Patch;
  needsShutter: (item: T) => boolean;
  /** The power the light is at now (kept with a new reading). */
  powerNow: (item: T) => number;
};

export type FieldSpec<T> = NumberFieldSpec<T> | ChoiceFieldSpec<T> | SwitchFieldSpec<T> | TextFieldSpec<T> | SectionSpec<T> | ReadingFieldSpec<T>;

/** What a meter reading's fields accept (the document's own limits). */
export const READING_RANGES = {
  aperture: { min: 0.7, max: 128 },
  iso: { min: 25, max: 409600 },
  distanceM: { min: 0.05, max: 50 },
  shutterS: { min: 1 / 8000, max: 60 },
} as const satisfies Record<string, Range>;

/** An f-number as typed: "8", "5.6", "f/8", "f8". */
export function parseFNumber(text: string): number | null {
  return parseNumber(text.trim().replace(/^f\s*\/?\s*/i, ''));
}

/** A field's label for the user's units. */
export const fieldLabel = (f: { label: string | ((units: Units) => string) }, units: Units) => (typeof f.label === 'function' ? f.label(units) : f.label);

const fixed = (d: number) => (v: number) => v.toFixed(d);
const round3 = (v: number) => Math.round(v * 1000) / 1000;

/** The range a field accepts, for this plan. */
export const rangeOf = (f: { range: NumberFieldSpec<never>['range'] }, ctx: FieldContext): Range => (typeof f.range === 'function' ? f.range(ctx) : f.range);

const clampTo = (r: Range, v: number) => Math.min(r.max, Math.max(r.min, v));

/**
 * A length in metres shown in the user's units ("2.50" under a label in m, or "5′ 6″"), stepping by `stepM`
 * inside `range` (metres; a fixed range or one from the plan, as positions on the stage).
 */
export function lengthField<T>(label: string, key: keyof T & string, stepM = 0.1, range: NumberFieldSpec<T>['range'] = { min: 0.01, max: 10 }, testID?: string): NumberFieldSpec<T> {
  const get = (i: T) => i[key] as number;
  return {
    type: 'number',
    label: (units) => `${label} (${unitSuffix(units)})`,
    range,
    get,
    set: (v) => ({ [key]: v }),
    format: (v, units) => lengthText(v, units),
    parse: parseLength,
    step: (i, d, ctx) => ({ [key]: round3(clampTo(rangeOf({ range }, ctx), get(i) + d * stepM)) }),
    ...(testID ? { testID } : {}),
  };
}

/** A plain number with `digits` decimals, accepted from `min` to `max`; steps by `by` when given, inside that range. */
export function numberField<T>(label: string, key: keyof T & string, opts: { min: number; max: number; digits?: number; by?: number; testID?: string }): NumberFieldSpec<T> {
  const get = (i: T) => i[key] as number;
  const { by } = opts;
  const range = { min: opts.min, max: opts.max };
  return {
    type: 'number',
    label,
    range,
    get,
    set: (v) => ({ [key]: v }),
    format: fixed(opts.digits ?? 0),
    parse: parseNumber,
    ...(by !== undefined ? { step: (i: T, d: -1 | 1) => ({ [key]: clampTo(range, get(i) + d * by) }) } : {}),
    ...(opts.testID ? { testID: opts.testID } : {}),
  };
}

/** What became of a typed value: the number to store, or a message saying what the field accepts. */
export type Checked = { ok: true; value: number } | { ok: false; message: string };

/**
 * Read and check what was typed into a number field (`parse` and `format` already in the user's units). The
 * message names the accepted range in the field's own notation ("Accepted: 1/8000 to 30″"), so a person sees
 * why the value did not take.
 */
export function checkTyped(text: string, f: { range: Range; parse: (t: string) => number | null; format: (v: number) => string; blankOk?: boolean }): Checked {
  const r = f.range;
  const accepted = `Accepted: ${f.format(r.min).trim()} to ${f.format(r.max).trim()}.`;
  if (f.blankOk && text.trim() === '') return { ok: true, value: -1 };
  const v = f.parse(text);
  if (v === null || !Number.isFinite(v)) return { ok: false, message: `Not a value this field reads. ${accepted}` };
  if (v < r.min - 1e-9 || v > r.max + 1e-9) return { ok: false, message: `Out of range. ${accepted}` };
  return { ok: true, value: v };
}

/** checkTyped for a field description, in the user's units, on this plan. */
export function checkNumber(f: Pick<NumberFieldSpec<never>, 'range' | 'parse' | 'format' | 'blankOk'>, text: string, units: Units, ctx: FieldContext): Checked {
  return checkTyped(text, { range: rangeOf(f, ctx), parse: (t) => f.parse(t, units), format: (v) => f.format(v, units), ...(f.blankOk ? { blankOk: true } : {}) });
}

export function choiceField<T>(label: string, key: keyof T & string, options: readonly Option[]): ChoiceFieldSpec<T> {
  return { type: 'choice', label, get: (i) => String(i[key]), options, set: (v) => ({ [key]: v }) };
}

export function switchField<T>(label: string, key: keyof T & string): SwitchFieldSpec<T> {
  return { type: 'switch', label, get: (i) => Boolean(i[key]), set: (v) => ({ [key]: v }) };
}

export function textField<T>(label: string, key: keyof T & string, multiline = false): TextFieldSpec<T> {
  return { type: 'text', label, get: (i) => String(i[key] ?? ''), set: (v) => ({ [key]: v }), ...(multiline ? { multiline } : {}) };
}

/** An f-number as the camera shows it ("8", "5.6"). */
export const formatFNumber = (v: number) => formatAperture(v).slice(2);

/** Simple options from plain words: the id is the word, shown with dashes as spaces. */
export const wordOptions = (words: readonly string[]): Option[] => words.map((w) => ({ id: w, label: w.replace('-', ' ') }));

/** The value in `list` nearest to v (by ratio), moved by d places, kept inside the list. */
export function stepIn(list: readonly number[], v: number, d: number): number {
  const i = list.reduce((best, x, k) => (Math.abs(Math.log(x / v)) < Math.abs(Math.log(list[best]! / v)) ? k : best), 0);
  return list[Math.min(list.length - 1, Math.max(0, i + d))]!;
}

/** A number, or −1 for a blank field (the field's "not set"). */
export const parseNumberOrBlank = (t: string) => (t.trim() === '' ? -1 : parseNumber(t));
