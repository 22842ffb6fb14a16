// An assignment's due date as a person types it: a day ("2027-03-01": the end of that day) or a day and a
// time ("2027-03-01 18:00"), in the reader's own time zone; blank is "no due date". The API stores an ISO
// date-time with its offset.

export type DueChecked = { ok: true; value: string | null } | { ok: false; message: string };

const FORM = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[ T](\d{1,2}):(\d{2}))?$/;
export const DUE_HINT = 'a day as 2027-03-01, with a time if you like: 2027-03-01 18:00';

export function parseDueDate(text: string, now: Date = new Date()): DueChecked {
  const t = text.trim();
  if (!t) return { ok: true, value: null };
  const m = FORM.exec(t);
  if (!m) return { ok: false, message: `Not a date this field reads: ${DUE_HINT}.` };
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const [h, mi] = m[4] !== undefined ? [Number(m[4]), Number(m[5])] : [23, 59];
  const at = new Date(y, mo - 1, d, h, mi);
  // The Date constructor rolls 31 February on to March; a day that does not exist is refused instead.
  if (at.getFullYear() !== y || at.getMonth() !== mo - 1 || at.getDate() !== d || h > 23 || mi > 59) return { ok: false, message: `No such day or time: ${DUE_HINT}.` };
  if (at.getTime() <= now.getTime()) return { ok: false, message: 'That is already past: give a day still to come.' };
  return { ok: true, value: at.toISOString() };
}

/** A stored due date as the field shows it ("2027-03-01 18:00", local time), or blank. */
export function dueDateText(iso: string | null): string {
  if (!iso) return '';
  const d = new Date(iso);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())} ${p(d.getHours())}:${p(d.getMinutes())}`;
}
