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

/** A length in the user's unit (metres, or decimal feet), for arithmetic; people see formatLength/lengthText. */
export const toDisplay = (m: number, units: Units) => (units === 'metric' ? m : m / M_PER_FT);
export const fromDisplay = (v: number, units: Units) => (units === 'metric' ? v : v * M_PER_FT);
export const unitSuffix = (units: Units) => (units === 'metric' ? 'm' : 'ft');

/**
 * A length as a field shows it: "2.50" in metric (the field's label says m), "5′ 6″" in imperial. What it
 * writes, parseLength reads back to the same text (5′ 6″ in, 5′ 6″ out).
 */
export function lengthText(m: number, units: Units, digits = 2): string {
  return units === 'metric' ? m.toFixed(digits) : formatLength(m, units);
}

/**
 * Read what a person typed as a length: "2.5", "2.5 m", "250 cm" in metric; "6", "6 ft", "6' 4\"", "5′ 6″",
 * "6ft 4in", "76 in", "5.5" (decimal feet, what a phone's number pad can type) in imperial. Returns metres, or
 * null when it is not a length.
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

/** Shutter as photographers write it: 1/200, 1/8, 0.3″, 2″ (a third-stop time over 1/4 s is written in seconds). */
export function formatShutter(t: number): string {
  if (t >= 0.3) return `${Number(t.toFixed(1))}″`;
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

/**
 * Read a shutter time as a camera shows it. "1/200" and a bare "200" (what the number pad types; cameras show
 * 1/200 s as 200) are 1/200 s; a time with a seconds mark or unit ("2″", "2s", "0.5″") and a bare decimal under
 * one ("0.5") are seconds. Null when it is not a time.
 */
export function parseShutter(text: string): number | null {
  const t = text.trim().replace(',', '.');
  const secs = t.match(/^(\d+(?:\.\d+)?|\.\d+)\s*(?:″|"|s|sec)$/i);
  if (secs) return Number(secs[1]) > 0 ? Number(secs[1]) : null;
  if (/^\d+$/.test(t)) return Number(t) > 0 ? 1 / Number(t) : null;
  const v = parseFraction(t);
  return v !== null && v > 0 ? v : null;
}

/**
 * Read a power setting: "1/8", "1/8 +0.3", a bare "8" (what the number pad types: 1/8), "1" (full) or a
 * decimal fraction of full ("0.25"). Null when it is not a power.
 */
export function parsePower(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (/^\d+$/.test(t)) return Number(t) >= 1 ? 1 / Number(t) : null;
  const v = parseFraction(t);
  return v !== null && v > 0 ? v : null;
}

// The standard third-stop scales cameras and meters step through (common practice): the marked values are
// rounded, so each step is about a third of a stop.
/** ISO, ascending. */
export const ISO_THIRDS = [25, 32, 40, 50, 64, 80, 100, 125, 160, 200, 250, 320, 400, 500, 640, 800, 1000, 1250, 1600, 2000, 2500, 3200, 4000, 5000, 6400, 8000, 10000, 12800, 16000, 20000, 25600, 51200, 102400, 204800, 409600];
/** f-numbers, ascending (wider to narrower). */
export const APERTURE_THIRDS = [1, 1.1, 1.2, 1.4, 1.6, 1.8, 2, 2.2, 2.5, 2.8, 3.2, 3.5, 4, 4.5, 5, 5.6, 6.3, 7.1, 8, 9, 10, 11, 13, 14, 16, 18, 20, 22, 25, 29, 32, 36, 40, 45, 51, 57, 64];
/** Shutter times in seconds, ascending (fastest first). */
export const SHUTTER_THIRDS = [
  1 / 8000, 1 / 6400, 1 / 5000, 1 / 4000, 1 / 3200, 1 / 2500, 1 / 2000, 1 / 1600, 1 / 1250, 1 / 1000, 1 / 800, 1 / 640, 1 / 500, 1 / 400, 1 / 320, 1 / 250, 1 / 200, 1 / 160, 1 / 125,
  1 / 100, 1 / 80, 1 / 60, 1 / 50, 1 / 40, 1 / 30, 1 / 25, 1 / 20, 1 / 15, 1 / 13, 1 / 10, 1 / 8, 1 / 6, 1 / 5, 1 / 4, 0.3, 0.4, 0.5, 0.6, 0.8, 1, 1.3, 1.6, 2, 2.5, 3.2, 4, 5, 6, 8, 10, 13, 15, 20, 25, 30,
];
