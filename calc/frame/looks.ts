/**
 * Looks applied to a rendered frame, without rendering again: colour, black and white, clipping marks and the
 * one-stop contours. Output is 8-bit sRGB RGBA (IEC 61966-2-1 encoding).
 */
import { linearToSrgb } from '../colour';
import type { FrameResult } from './render';

/**
 * Black and white as a photographer converts: relative luminance of the linear sRGB, with the Rec. 709 / sRGB
 * weights (ITU-R BT.709-6 item 3.3; IEC 61966-2-1), after each channel has clipped as the camera's file would.
 */
export const REC709_LUMA_WEIGHTS = { r: 0.2126, g: 0.7152, b: 0.0722 } as const;

export type FrameLook = {
  mono?: boolean;
  /** Mark clipped pixels with stripes: red where every channel clips, amber where only some do (a gelled colour). */
  clipping?: boolean;
  /** One-stop contour lines of the incident exposure, relative to the subject (the light map's levels). */
  contours?: boolean;
};

/** Stops below which a pixel counts as crushed to black in the clipping look (our own threshold: 1/512). */
const CRUSH_LINEAR = 1 / 512;

const ENCODE = new Uint8Array(4097);
for (let i = 0; i <= 4096; i++) ENCODE[i] = Math.round(linearToSrgb(i / 4096) * 255);
/** 8-bit sRGB of a linear value, clipped to 0–1 (table of 4097 steps; within 1 code value of the formula). */
export function encode8(v: number): number {
  if (!(v > 0)) return 0;
  if (v >= 1) return 255;
  // Below 1/64 the table is too coarse for the toe: use the formula.
  return v < 1 / 64 ? Math.round(linearToSrgb(v) * 255) : ENCODE[Math.round(v * 4096)]!;
}

export function applyLook(frame: FrameResult, look: FrameLook = {}, out?: Uint8ClampedArray): Uint8ClampedArray {
  const { width: W, height: H, linear, stops, ids } = frame;
  const rgba = out ?? new Uint8ClampedArray(W * H * 4);
  const { r: wr, g: wg, b: wb } = REC709_LUMA_WEIGHTS;
  const ref = frame.subjectStops ?? 0;
  for (let y = 0; y < H; y++) {
    for (let x = 0; x < W; x++) {
      const i = y * W + x;
      const lr = linear[i * 3]!;
      const lg = linear[i * 3 + 1]!;
      const lb = linear[i * 3 + 2]!;
      const cr = Math.min(1, Math.max(0, lr));
      const cg = Math.min(1, Math.max(0, lg));
      const cb = Math.min(1, Math.max(0, lb));
      let R: number;
      let G: number;
      let B: number;
      if (look.mono) {
        const v = encode8(wr * cr + wg * cg + wb * cb);
        R = G = B = v;
      } else {
        R = encode8(cr);
        G = encode8(cg);
        B = encode8(cb);
      }
      if (look.clipping && ids[i] !== -1) {
        const n = (lr >= 1 ? 1 : 0) + (lg >= 1 ? 1 : 0) + (lb >= 1 ? 1 : 0);
        const stripe = ((x + y) >> 2) & 1;
        if (n > 0 && stripe) {
          if (n === 3) [R, G, B] = [230, 30, 40];
          else [R, G, B] = [255, 176, 0];
        } else if (n === 0 && Math.max(lr, lg, lb) < CRUSH_LINEAR && stripe) [R, G, B] = [40, 90, 255];
      }
      if (look.contours) {
        const s = stops[i]!;
        if (s === s) {
          const lv = Math.floor(s - ref);
          const right = x + 1 < W ? stops[i + 1]! : NaN;
          const down = y + 1 < H ? stops[i + W]! : NaN;
          const edge =
            (right === right && ids[i + 1] === ids[i] && Math.floor(right - ref) !== lv) ||
            (down === down && ids[i + W] === ids[i] && Math.floor(down - ref) !== lv);
          if (edge && lv >= -6) {
            // The subject's level (0) in amber, the others in white.
            let lvl = lv;
            if (right === right) lvl = Math.max(lvl, Math.floor(right - ref));
            if (down === down) lvl = Math.max(lvl, Math.floor(down - ref));
            if (lvl === 0) [R, G, B] = [255, 196, 60];
            else [R, G, B] = [235, 235, 235];
          }
        }
      }
      rgba[i * 4] = R;
      rgba[i * 4 + 1] = G;
      rgba[i * 4 + 2] = B;
      rgba[i * 4 + 3] = 255;
    }
  }
  return rgba;
}
