// Lengths are metres everywhere inside; a user who works in feet sees and types feet and inches.
export type Units = 'metric' | 'imperial';

export const M_PER_FT = 0.3048; // exact, by the international foot

/** "1.25 m" or "4′ 1″" (nearest inch). */
export function formatLength(m: number, units: Units, digits = 2): string {
  if (units === 'metric') return `${m.toFixed(digits)} m`;
  const totalIn = Math.round(m / (M_PER_FT / 12));
  const sign = totalIn < 0 ? '−' : '';
  const ft = Math.floor(Math.abs(totalIn) / 12);
  const inch = Math.abs(totalIn) % 12;
  return `${sign}${ft}′ ${inch}″`;
}

/** A length field's number in the user's unit (metres, or decimal feet). */
export const toDisplay = (m: number, units: Units) => (units === 'metric' ? m : m / M_PER_FT);
export const fromDisplay = (v: number, units: Units) => (units === 'metric' ? v : v * M_PER_FT);
export const unitSuffix = (units: Units) => (units === 'metric' ? 'm' : 'ft');

/**
 * Read what a person typed as a length: "2.5", "2.5 m", "250 cm" in metric; "6", "6 ft", "6' 4\"", "6ft 4in",
 * "76 in" in imperial. Returns metres, or null when it is not a length.
 */
export function parseLength(text: string, units: Units): number | null {
  const t = text.trim().toLowerCase().replace(/,/g, '.').replace(/[′’]/g, "'").replace(/[″”]/g, '"');
  if (!t) return null;
  const num = '(-?\\d+(?:\\.\\d+)?|-?\\.\\d+)';
  let m: RegExpMatchArray | null;
  if ((m = t.match(new RegExp(`^${num}\\s*(m|cm|mm)?$`)))) {
    const v = Number(m[1]);
    if (m[2] === 'cm') return v / 100;
    if (m[2] === 'mm') return v / 1000;
    if (m[2] === 'm' || units === 'metric') return v;
    return v * M_PER_FT;
  }
  if ((m = t.match(new RegExp(`^${num}\\s*(?:'|ft|feet)\\s*(?:${num}\\s*(?:"|in|inches)?)?$`)))) {
    return (Number(m[1]) + Number(m[2] ?? 0) / 12) * M_PER_FT;
  }
  if ((m = t.match(new RegExp(`^${num}\\s*(?:"|in|inches)$`)))) return (Number(m[1]) / 12) * M_PER_FT;
  return null;
}

/** f-number as photographers write it: f/8, f/5.6, f/11. */
export function formatAperture(n: number | null): string {
  if (n === null || !Number.isFinite(n)) return '—';
  return `f/${n >= 10 ? n.toFixed(0) : n.toFixed(1).replace(/\.0$/, '')}`;
}

/** Stops with a sign and one decimal: +0.3, −2.0. */
export function formatStops(s: number | null): string {
  if (s === null || !Number.isFinite(s)) return '—';
  const r = Math.round(s * 10) / 10;
  return `${r > 0 ? '+' : r < 0 ? '−' : '±'}${Math.abs(r).toFixed(1)}`;
}

/** Shutter as photographers write it: 1/200, 1/8, 0.5″, 2″. */
export function formatShutter(t: number): string {
  if (t >= 0.5) return `${Number(t.toFixed(1))}″`;
  return `1/${Math.round(1 / t)}`;
}

/**
 * Power as a fraction of full: the nearest step of the usual ladder (1/1, 1/2 … 1/256, each one stop) and,
 * when it is between steps, the tenths of a stop to add or take off, as most heads display it: "1/8 −0.3".
 */
export function formatPower(fraction: number): string {
  const stops = Math.log2(fraction);
  const whole = Math.round(stops);
  const rest = Math.round((stops - whole) * 10) / 10;
  const step = whole >= 0 ? '1/1' : `1/${2 ** -whole}`;
  return rest === 0 ? step : `${step} ${rest > 0 ? '+' : '−'}${Math.abs(rest).toFixed(1)}`;
}

/** Read a number as typed: "8", "5,6", "f/8" (the f/ is dropped). Null when it is not one. */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(/^f\s*\/\s*/i, '').replace(',', '.');
  if (!t || !/^[-+]?(\d+(\.\d*)?|\.\d+)$/.test(t)) return null;
  return Number(t);
}

/**
 * Read a fraction as photographers write shutter and power: "1/200", "1 / 8", a plain number ("0.5"), or a
 * power with tenths of a stop as formatPower writes it ("1/8 +0.3", "1/8 −0.3").
 */
export function parseFraction(text: string): number | null {
  const t = text.trim();
  const m = t.match(/^1\s*\/\s*(\d+(?:[.,]\d+)?)(?:\s*([+−-])\s*(\d*[.,]?\d+))?$/);
  if (m) {
    const d = Number(m[1]!.replace(',', '.'));
    if (!(d > 0)) return null;
    const tenths = m[3] ? Number(m[3].replace(',', '.')) * (m[2] === '+' ? 1 : -1) : 0;
    return 2 ** (Math.log2(1 / d) + tenths);
  }
  return parseNumber(text.replace(/[″"s]$/, ''));
}
