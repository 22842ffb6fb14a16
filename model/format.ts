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
const TIME: Intl.DateTimeFormatOptions = { hour: '2-digit', minute: '2-digit' };

/** "3 Dec 2026" (en-GB), "Dec 3, 2026" (en-US): the month as a word, so no reader mistakes day for month. */
export function formatDate(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...DAY, ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

/** "3 Dec 2026, 14:05" in the reader's locale. */
export function formatDateTime(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...DAY, ...TIME, ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

/** "14:05" in the reader's locale. */
export function formatTime(d: DateInput, locale?: string, timeZone?: string): string {
  return dtf(locale, { ...TIME, ...(timeZone ? { timeZone } : {}) }).format(new Date(d));
}

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
