/**
 * Colour of light and surfaces, in linear sRGB (IEC 61966-2-1 primaries, D65 white).
 *
 * Light colour is carried as a linear-RGB triple normalised to relative luminance Y = 1, so the photometric
 * quantity (lux, lux·s) and the colour are independent: "E lux of colour c" means the triple E·c, whose Y is E.
 * Parsing and hex output go through culori; the few formulas the meter needs in its own loops are written
 * out here and checked against culori in the tests.
 */
import { converter, formatHex, parse } from 'culori';

/** Linear sRGB triple (r, g, b), unbounded above. */
export type Rgb = readonly [number, number, number];

const toLrgb = converter('lrgb');
const toXyz65 = converter('xyz65');

/** sRGB decoding (IEC 61966-2-1): encoded value 0–1 → linear. */
export function srgbToLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
}

/** sRGB encoding (IEC 61966-2-1): linear 0–1 → encoded. */
export function linearToSrgb(c: number): number {
  return c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
}

/** Relative luminance Y of a linear sRGB triple (IEC 61966-2-1 / ITU-R BT.709 primaries, D65). */
export function relativeLuminance(rgb: Rgb): number {
  return 0.2126 * rgb[0] + 0.7152 * rgb[1] + 0.0722 * rgb[2];
}

/**
 * True when the string is a CSS colour culori can read (CSS Color 4 syntax). culori's own `color(--space …)`
 * syntax is refused: the web build carries only the spaces CSS writes (web/culoriCss.js), and the browser
 * and the server must accept the same colours.
 */
export function isColour(s: string): boolean {
  const hit = readable.get(s);
  if (hit !== undefined) return hit;
  const ok = !/^\s*color\(\s*--/i.test(s) && parse(s) !== undefined;
  // A scene's few colours are checked at every parse (the meter's worker parses each job's scene): keep the answers.
  if (readable.size > 512) readable.clear();
  readable.set(s, ok);
  return ok;
}
const readable = new Map<string, boolean>();

/** Linear sRGB of a CSS colour string; throws on an unreadable colour (the scene schema rejects those first). */
export function linearRgbOf(colour: string): Rgb {
  const hit = colourCache.get(colour);
  if (hit) return hit;
  const c = toLrgb(colour);
  if (!c) throw new Error(`not a colour: ${colour}`);
  const rgb: Rgb = [c.r, c.g, c.b];
  if (colourCache.size > 512) colourCache.clear();
  colourCache.set(colour, rgb);
  return rgb;
}
const colourCache = new Map<string, Rgb>();

/**
 * Real paints and papers reflect roughly 5–85 % of light (light reflectance values; from memory), so a
 * reflectance taken from a colour is clamped to that range: "#ffffff" paper does not reflect 100 %.
 * An explicit reflectance in the scene is used as given.
 */
const PAINT_REFLECTANCE_MIN = 0.05;
export const PAINT_REFLECTANCE_MAX = 0.85;

/**
 * Per-channel diffuse reflectance of a surface: the colour's linear sRGB, scaled so that its relative
 * luminance equals `reflectance` when given, else the colour's own relative luminance clamped to the paint range.
 * A black colour with an explicit reflectance becomes a neutral grey of that reflectance.
 */
export function surfaceReflectance(colour: string, reflectance?: number): { rgb: Rgb; y: number } {
  const lin = linearRgbOf(colour);
  const y0 = relativeLuminance(lin);
  const y =
    reflectance ?? Math.min(PAINT_REFLECTANCE_MAX, Math.max(PAINT_REFLECTANCE_MIN, y0));
  if (y0 <= 1e-9) return { rgb: [y, y, y], y };
  const k = y / y0;
  return { rgb: [lin[0] * k, lin[1] * k, lin[2] * k], y };
}

/**
 * Chromaticity (CIE 1931 x, y) of a Planckian radiator, by the cubic-spline fit of Kim et al. (2002),
 * valid 1667–25 000 K; the input is clamped to that range.
 */
export function planckianXy(kelvin: number): { x: number; y: number } {
  const t = Math.min(25000, Math.max(1667, kelvin));
  const t2 = t * t;
  const t3 = t2 * t;
  const x =
    t <= 4000
      ? -0.2661239e9 / t3 - 0.2343589e6 / t2 + 0.8776956e3 / t + 0.17991
      : -3.0258469e9 / t3 + 2.1070379e6 / t2 + 0.2226347e3 / t + 0.24039;
  const x2 = x * x;
  const x3 = x2 * x;
  const y =
    t <= 2222
      ? -1.1063814 * x3 - 1.3481102 * x2 + 2.18555832 * x - 0.20219683
      : t <= 4000
        ? -0.9549476 * x3 - 1.37418593 * x2 + 2.09137015 * x - 0.16748867
        : 3.081758 * x3 - 5.8733867 * x2 + 3.75112997 * x - 0.37001483;
  return { x, y };
}

/** Linear sRGB of chromaticity (x, y) at luminance Y = 1, negative channels clipped to 0 (out of gamut). */
function linearRgbFromXy(x: number, y: number): Rgb {
  const c = toLrgb({ mode: 'xyz65', x: x / y, y: 1, z: (1 - x - y) / y });
  return normaliseLuminance([Math.max(0, c.r), Math.max(0, c.g), Math.max(0, c.b)]);
}

/** CIE 1931 chromaticity of a linear sRGB triple, or null for black. */
export function xyOfLinearRgb(rgb: Rgb): { x: number; y: number } | null {
  const c = toXyz65({ mode: 'lrgb', r: rgb[0], g: rgb[1], b: rgb[2] });
  const s = c.x + c.y + c.z;
  if (!(s > 1e-12)) return null;
  return { x: c.x / s, y: c.y / s };
}

/** Correlated colour temperature (K) of chromaticity (x, y) by McCamy's cubic (1992). */
export function mcCamyCct(x: number, y: number): number {
  const n = (x - 0.332) / (0.1858 - y);
  return 449 * n * n * n + 3525 * n * n + 6823.3 * n + 5520.33;
}

/** CIE 1960 UCS (u, v) of chromaticity (x, y). */
function uvOfXy(x: number, y: number): { u: number; v: number } {
  const d = -2 * x + 12 * y + 3;
  return { u: (4 * x) / d, v: (6 * y) / d };
}

/**
 * A correlated colour temperature is only meaningful close to the Planckian locus: CIE practice limits it to
 * a distance Δuv ≤ 0.05 in the 1960 UCS diagram (from memory). Beyond that (a red or deep-blue gel) the
 * meter reports no colour temperature. McCamy's cubic is also only fitted for roughly 2000–12 500 K.
 */
const CCT_MAX_DUV = 0.05;

/** CCT (K) of a linear RGB mix, or null when the colour is black or too far from the Planckian locus. */
export function cctOfLinearRgb(rgb: Rgb): number | null {
  const xy = xyOfLinearRgb(rgb);
  if (!xy) return null;
  const cct = mcCamyCct(xy.x, xy.y);
  if (!(cct >= 1667 && cct <= 25000)) return null;
  const p = planckianXy(cct);
  const a = uvOfXy(xy.x, xy.y);
  const b = uvOfXy(p.x, p.y);
  return Math.hypot(a.u - b.u, a.v - b.v) <= CCT_MAX_DUV ? cct : null;
}

/** Scale a triple to relative luminance 1 (black stays black). */
export function normaliseLuminance(rgb: Rgb): Rgb {
  const y = relativeLuminance(rgb);
  return y > 1e-12 ? [rgb[0] / y, rgb[1] / y, rgb[2] / y] : [0, 0, 0];
}

/** Linear sRGB (Y = 1) of a Planckian source at `kelvin`. Memoised: the meter asks for a few values per frame. */
export function kelvinToLinearRgb(kelvin: number): Rgb {
  const hit = kelvinCache.get(kelvin);
  if (hit) return hit;
  const { x, y } = planckianXy(kelvin);
  const rgb = linearRgbFromXy(x, y);
  if (kelvinCache.size > 512) kelvinCache.clear();
  kelvinCache.set(kelvin, rgb);
  return rgb;
}
const kelvinCache = new Map<number, Rgb>();

/**
 * Hex of a colour's hue and saturation, brightness removed (largest channel scaled to 1). With whiteBalanceK
 * the channels are first divided by that source's colour, a per-channel gain like a camera's white balance
 * (not a full chromatic adaptation), so a light at the white-balance temperature shows as #ffffff.
 */
export function hueHex(rgb: Rgb, whiteBalanceK?: number): string {
  let r = rgb[0];
  let g = rgb[1];
  let b = rgb[2];
  if (whiteBalanceK !== undefined) {
    const w = kelvinToLinearRgb(whiteBalanceK);
    r = w[0] > 0 ? r / w[0] : r;
    g = w[1] > 0 ? g / w[1] : g;
    b = w[2] > 0 ? b / w[2] : b;
  }
  const m = Math.max(r, g, b);
  if (!(m > 0)) return '#000000';
  return linearRgbToHex([r / m, g / m, b / m]);
}

/**
 * Hex of a linear sRGB colour (channels clamped to 0–1), encoded per IEC 61966-2-1. Written out because
 * culori's formatHex costs ~15 µs a call, a sizeable share of a meter frame; the tests check it against culori.
 */
export function linearRgbToHex(rgb: Rgb): string {
  let s = '#';
  for (let i = 0; i < 3; i++) {
    const c = Math.min(1, Math.max(0, rgb[i]!));
    const v = Math.round(linearToSrgb(c) * 255);
    s += (v < 16 ? '0' : '') + v.toString(16);
  }
  return s;
}

/** culori's hex of a linear sRGB colour; the reference linearRgbToHex is tested against. */
export function culoriHexOfLinear(rgb: Rgb): string {
  return formatHex({ mode: 'lrgb', r: rgb[0], g: rgb[1], b: rgb[2] });
}
