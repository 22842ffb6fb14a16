// Text rules shared by every schema that takes words from a person: titles, names, labels, notes, comments.
// - No NUL or other control characters (C0, DEL, C1): they break PostgreSQL text and jsonb (NUL), XML exports
//   and mail headers. Multi-line text keeps newline and tab (a carriage return is folded into the newline).
// - No lone UTF-16 surrogates or the non-characters U+FFFE/U+FFFF: PostgreSQL and XML refuse them.
// - Bidirectional override and isolate controls (U+202A–U+202E, U+2066–U+2069) are removed from one-line text
//   (titles, names, labels, mail subjects), where they can make a title read backwards.
// - Every text has a length cap.
import { z } from 'zod';

const CONTROL_ONE_LINE = /[\u0000-\u001f\u007f-\u009f]/;
const CONTROL_MULTI_LINE = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;
const NON_CHARACTER = /[\ufffe\uffff]/;
const BIDI_CONTROL = /[\u202a-\u202e\u2066-\u2069]/g;

const NO_CONTROL_MESSAGE = 'no control characters (such as NUL) allowed';

/** True when `s` is text PostgreSQL and XML both take: well-formed UTF-16, no non-characters. */
function isStorableText(s: string): boolean {
  return s.isWellFormed() && !NON_CHARACTER.test(s);
}

function hasControlCharacters(s: string, { multiLine = false } = {}): boolean {
  return (multiLine ? CONTROL_MULTI_LINE : CONTROL_ONE_LINE).test(s);
}

function stripBidiControls(s: string): string {
  return s.replace(BIDI_CONTROL, '');
}

/**
 * Make any stored text safe to draw or to put in XML: control characters other than newline and tab become a
 * space, lone surrogates and non-characters become U+FFFD. For text stored before these rules (exports), never
 * for input (input is refused instead).
 */
export function cleanForDisplay(s: string): string {
  return stripBidiControls(s.toWellFormed().replace(/[\ufffe\uffff]/g, '\ufffd').replace(/\r\n?/g, '\n').replace(new RegExp(CONTROL_MULTI_LINE.source, 'g'), ' '));
}

type Caps = { max: number; min?: number; minMessage?: string };

/** Digits in groups of three with a space ("20 000"). Not toLocaleString: that builds an Intl formatter on every
 *  call, and the document model builds hundreds of these caps on import (it was half of the share page's
 *  longest task at start on a phone). */
const grouped = (n: number) => String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ' ');
const capMessage = (max: number) => `at most ${grouped(max)} characters`;

/**
 * One line of text (a title, a name, a label, a mail subject): no control characters at all, bidi controls
 * removed, trimmed, then checked against `min` (when given) and `max`.
 */
export function oneLine({ max, min, minMessage }: Caps) {
  let s = z
    .string()
    .refine(isStorableText, 'not valid text (broken characters)')
    .refine((v) => !hasControlCharacters(v), NO_CONTROL_MESSAGE)
    .overwrite(stripBidiControls)
    .trim();
  if (min) s = s.min(min, minMessage ?? `at least ${min} character${min > 1 ? 's' : ''}`);
  return s.max(max, capMessage(max));
}

/** Text over several lines (notes, comments, briefs): newline and tab allowed, other control characters not. */
export function multiLine({ max, min, minMessage, trim = false }: Caps & { trim?: boolean }) {
  let s = z
    .string()
    .refine(isStorableText, 'not valid text (broken characters)')
    .refine((v) => !hasControlCharacters(v, { multiLine: true }), NO_CONTROL_MESSAGE)
    .overwrite((v) => v.replace(/\r\n?/g, '\n'));
  if (trim) s = s.trim();
  if (min) s = s.min(min, minMessage ?? `at least ${min} character${min > 1 ? 's' : ''}`);
  return s.max(max, capMessage(max));
}

/** A short free token typed by a person (a search, a cursor): any text without control characters, capped. */
export function plainQuery(max: number) {
  return z
    .string()
    .refine(isStorableText, 'not valid text (broken characters)')
    .refine((v) => !hasControlCharacters(v), NO_CONTROL_MESSAGE)
    .max(max, capMessage(max));
}

/**
 * Every string in a stored JSON value (a setup document) made safe with `cleanForDisplay`. Documents saved
 * before these rules may hold control characters; reading them cleans them, so an export of any stored
 * label is well-formed, while new input with them is refused by the schemas above.
 */
export function cleanStoredText(value: unknown, depth = 0): unknown {
  if (typeof value === 'string') return cleanForDisplay(value);
  if (depth > 64 || value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return value.map((v) => cleanStoredText(v, depth + 1));
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value)) out[k] = cleanStoredText(v, depth + 1);
  return out;
}
