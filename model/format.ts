// Words and dates as people read them: one date/time formatter (locale-aware, never the ambiguous 12/3/2026:
// the month is always a word) and counts through the locale's plural rules ("1 student", "2 students").
// `locale` is for tests and the server's exports; the app passes nothing and gets the reader's own.

export type DateInput = string | number | Date;

const cache = new Map<string, Intl.DateTimeFormat>();
function dtf(locale: string | undefined, opts: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale ?? ''}|${JSON.stringify(opts)}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(locale, opts);
    cache.set(key, f);
  }
  return f;
}

const DAY: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };

const twelveHour = new Map<string, boolean>();
/**
 * The hour as the locale writes a clock: "4:18 PM" where the day has two halves (no padded "04:18 PM"),
 * "09:05" on a 24-hour clock.
 */
function time(locale: string | undefined): Intl.DateTimeFormatOptions {
  let h12 = twelveHour.get(locale ?? '');
  if (h12 === undefined) {
    const cycle = new Intl.DateTimeFormat(locale, { hour: 'numeric' }).resolvedOptions().hourCycle;
    h12 = cycle === 'h11' || cycle === 'h12';
    twelveHour.set(locale ?? '', h12);
  }
  return { hour: h12 ? 'numeric' : '2-digit', minute: '2-digit' };
}

/** "3 Dec 2026" (en-GB), "Dec 3, 2026" (en-US): the month as a word, so no reader mistakes day for month. */
export function formatDate(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...DAY, ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

/** "3 Dec 2026, 14:05" (en-GB), "Dec 3, 2026, 2:05 PM" (en-US) in the reader's locale. */
export function formatDateTime(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...DAY, ...time(locale), ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

/** "14:05" (en-GB), "2:05 PM" (en-US) in the reader's locale. */
export function formatTime(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...time(locale), ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

/**
 * When something happened, for a list of events (comments, replies): "today, 14:05" for today in the reader's
 * calendar, else the full date and time. `now` is for tests.
 */
export function formatWhen(d: DateInput, o: { now?: DateInput; locale?: string; timeZone?: string } = {}): string {
  const day = (x: DateInput) => formatDate(x, o.locale, o.timeZone);
  return day(d) === day(o.now ?? Date.now()) ? `today, ${formatTime(d, o.locale, o.timeZone)}` : formatDateTime(d, o.locale, o.timeZone);
}

/** A file's size while it downloads or once saved: "1 KB" at the least, whole kilobytes (1024 bytes). */
export const kb = (bytes: number) => `${Math.max(1, Math.round(bytes / 1024))} KB`;

const rulesCache = new Map<string, Intl.PluralRules>();
/**
 * A count with its noun in the right form: count(1, 'student') → "1 student", count(2, 'student') →
 * "2 students". Irregular plurals give both forms: count(3, 'person', 'people').
 */
export function count(n: number, one: string, other = `${one}s`, locale?: string): string {
  let rules = rulesCache.get(locale ?? '');
  if (!rules) {
    rules = new Intl.PluralRules(locale ?? 'en');
    rulesCache.set(locale ?? '', rules);
  }
  return `${n} ${rules.select(n) === 'one' ? one : other}`;
}

/** The key:fill reading's line under its ratio, the same in the editor's meter and a lesson's: the stops, and how
 *  many panels on the fill side send the key's light back (a reflector or v-flat fills as a light does). */
export function keyFillDetail(kf: { ratioStops: number | null; fillPanels: { panelIds: readonly string[] } }): string {
  if (kf.ratioStops === null) return 'needs a key and a fill (a light or a reflector)';
  const n = kf.fillPanels.panelIds.length;
  return `${kf.ratioStops.toFixed(1)} stops${n > 0 ? `, fill side with the key off ${count(n, 'panel')}` : ''}`;
}
