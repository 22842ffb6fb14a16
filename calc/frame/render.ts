/**
 * The frame: what the camera records, ray cast through the lens and shaded with the meter's own light at every
 * visible point. Pure TypeScript; the editor runs it in a Web Worker and the server for its PNG and crew sheet.
 *
 * Shading (per pixel, linear sRGB): value = albedo ⊙ H_rgb ⊙ wb / H_correct, where H_rgb is the meter's
 * exposure at the hit point facing its surface normal (direct + bounce + ambient, lux·s per channel),
 * H_correct the exposure an incident meter reads as the camera's setting (ISO 2720, C as the meter's; lens ND
 * included) and wb the white balance's per-channel gains. So an 18 % grey under a "correct" reading is linear
 * 0.18, sRGB ≈ 118 (IEC 61966-2-1). Channels are clipped at 1 when the look is applied (looks.ts).
 */
import { kelvinToLinearRgb, linearRgbOf, surfaceReflectance } from '../colour';
import { panelFrame, surfaceOptics } from '../flatScene';
import type { RoomLight } from '../room';
import { type Field, type Receptor, bounceInto, directInto, exposureAt, prepareField } from './field';
import { type FrameInput, type FrameScene, SKIN_HUE, SKIN_TONES, parseFrameInput } from './scene';
import { MAT_CLOTH, MAT_EYE, type Solids, buildBoxes, buildSubjectSolids, hitBoxes, hitSolids, solidNormal, solidsClear } from './solids';

export { FRAME_LIMITS } from './limits';

/** Reflectance of clothing on the neutral form (our own mid-dark grey) and of the eye (mostly the dark iris and pupil that show between the lids). */
const CLOTH_REFLECTANCE = 0.1;
const EYE_REFLECTANCE = 0.05;
/** Reflectance of the cornea at normal incidence, about 2.5 % (n ≈ 1.376; Fresnel). */
const CORNEA_REFLECTANCE = 0.025;
/**
 * Smallest angular radius (of the reflected ray about the light) a catchlight is drawn with, radians: a small
 * or distant light's true mirror image is under a pixel at any useful frame size, so it is drawn this large.
 */
const MIN_CATCHLIGHT_RAD = 0.45;
/** Flags and scrims seen by the lens: near-black fabric (from memory). */
const FLAG_REFLECTANCE = 0.04;
const PROP_COLOUR = '#7d6c5a';

/** Object ids in `FrameResult.ids`. */
const ID_VOID = -1;
const ID_FLOOR = 0;
const ID_CEILING = 1;
export const ID_SURFACE = 100; // + surface index
const ID_FLAG = 200; // + flag index
export const ID_SUBJECT = 300;
const ID_PROP = 400; // + prop index

export type FrameCamera = {
  ox: number;
  oy: number;
  oz: number;
  /** Forward, right and up unit vectors. */
  f: [number, number, number];
  r: [number, number, number];
  u: [number, number, number];
  /** tan of half the horizontal and vertical angle of view. */
  tanH: number;
  tanV: number;
};

export type FrameResult = {
  width: number;
  height: number;
  /** Linear sRGB after exposure and white balance, unclipped, 3 per pixel, row-major from the top left. */
  linear: Float32Array;
  /** Incident exposure at each visible point, stops vs the camera's "correct" (0 = correct); NaN where nothing. */
  stops: Float32Array;
  /** What each pixel sees (ID_* constants). */
  ids: Int32Array;
  /** The subject's metered exposure, stops vs the camera (the light map's reference), or null if unlit. */
  subjectStops: number | null;
  camera: FrameCamera;
};

export type RenderOptions = {
  width: number;
  /**
   * The light is computed in full every `latticeStep` pixels on each axis and interpolated between lattice
   * points that see the same object and agree (see renderFrame); elsewhere per pixel. 1 = every pixel.
   */
  latticeStep?: number;
};

function frameCamera(fs: FrameScene): FrameCamera {
  const c = fs.scene.camera;
  const a = (c.aimDeg * Math.PI) / 180;
  const t = (fs.extras.cameraTiltDeg * Math.PI) / 180;
  const f: [number, number, number] = [Math.cos(t) * Math.cos(a), Math.cos(t) * Math.sin(a), Math.sin(t)];
  // Right of the view on the plan is the aim turned 90° clockwise (towards +y for an aim along +x).
  const r: [number, number, number] = [-Math.sin(a), Math.cos(a), 0];
  const u: [number, number, number] = [-Math.sin(t) * Math.cos(a), -Math.sin(t) * Math.sin(a), Math.cos(t)];
  const tanH = c.sensorWidthMm / (2 * c.focalMm);
  const tanV = c.sensorHeightMm / (2 * c.focalMm);
  return { ox: c.x, oy: c.y, oz: c.heightM, f, r, u, tanH, tanV };
}

/** Image height for a width, from the sensor's aspect ratio. */
function frameHeight(fs: FrameScene, width: number): number {
  const c = fs.scene.camera;
  return Math.max(1, Math.round((width * c.sensorHeightMm) / c.sensorWidthMm));
}

/** Where a world point lands in the frame (pixel coordinates, may be outside), or null behind the camera. */
export function projectToFrame(cam: FrameCamera, width: number, height: number, x: number, y: number, z: number): { px: number; py: number } | null {
  const vx = x - cam.ox;
  const vy = y - cam.oy;
  const vz = z - cam.oz;
  const zf = vx * cam.f[0] + vy * cam.f[1] + vz * cam.f[2];
  if (zf <= 1e-9) return null;
  const xr = (vx * cam.r[0] + vy * cam.r[1] + vz * cam.r[2]) / zf;
  const yu = (vx * cam.u[0] + vy * cam.u[1] + vz * cam.u[2]) / zf;
  return { px: (xr / cam.tanH / 2 + 0.5) * width - 0.5, py: (0.5 - yu / cam.tanV / 2) * height - 0.5 };
}

/** Largest ratio between the direct light at four lattice corners that is still interpolated (about 0.1 stop). */
const DIRECT_SPREAD = 1.15;
/**
 * On the finest (2-pixel) lattice a wider spread is still interpolated: across two pixels a smooth fall-off is
 * near linear (a ratio of 1.5 interpolates within 2 %), and a hard shadow's edge is a larger step.
 */
const FINE_SPREAD = 1.5;
/** On the 4-pixel lattice (a ratio of 1.25 interpolates within 1 %). */
const MID_SPREAD = 1.25;
/**
 * …or differs by less than this fraction of the camera's "correct" exposure (in the shadows a 10 % spread is
 * invisible: 1/1024 of correct is under a code value of 8-bit sRGB on a white surface).
 */
const DIRECT_FLOOR = 1 / 1024;

/** One lattice of the direct light: every `s`-th pixel (and the last row and column), filled on demand. */
type LatticeLevel = {
  s: number;
  LX: number;
  LY: number;
  D: Float64Array;
  done: Uint8Array;
  /** Per cell (by its top-left corner): 0 not yet decided, 1 interpolated, 2 not; and the object its corners see. */
  state: Uint8Array;
  cellId: Int32Array;
};
/** Lattices of `step`, `step`/2, … down to 2 pixels (none for step 1: every pixel is computed). */
function latticeLevels(W: number, H: number, step: number, cache = true): LatticeLevel[] {
  const out: LatticeLevel[] = [];
  if (W < 2 || H < 2) return out;
  for (let s = step; s >= 2; s = Math.floor(s / 2)) {
    const LX = Math.ceil((W - 1) / s) + 1;
    const LY = Math.ceil((H - 1) / s) + 1;
    const key = `${s}:${LX}:${LY}`;
    let v = cache ? levelCache.get(key) : undefined;
    if (!v) {
      v = { s, LX, LY, D: new Float64Array(LX * LY * 3), done: new Uint8Array(LX * LY), state: new Uint8Array(LX * LY), cellId: new Int32Array(LX * LY) };
      if (levelCache.size > 16) levelCache.clear();
      if (cache) levelCache.set(key, v);
    } else {
      v.done.fill(0);
      v.state.fill(0);
    }
    out.push(v);
  }
  return out;
}

/**
 * Working arrays kept between renders (a drag renders many frames of one size; fresh arrays of a few MB each
 * time cost more in garbage collection than the light itself). Renders run one at a time on a thread.
 */
const levelCache = new Map<string, LatticeLevel>();
type Scratch = { n: number; hitP: Float32Array; hitN: Float32Array; alb: Float32Array; see: Float32Array; mats: Uint8Array };
let scratch: Scratch | null = null;
function scratchFor(N: number): Scratch {
  if (scratch && scratch.n >= N) return scratch;
  const fresh = { n: N, hitP: new Float32Array(N * 3), hitN: new Float32Array(N * 3), alb: new Float32Array(N * 3), see: new Float32Array(N), mats: new Uint8Array(N) };
  // Kept up to about a 1200 × 800 frame; a larger one (a print export) gets its own.
  if (N <= 1_000_000) scratch = fresh;
  return fresh;
}

/** Imported constants as local ones: the inner loops read them per pixel. */
const EYE = MAT_EYE;
const CLOTH = MAT_CLOTH;

/** Tiles of the picture the form's parts are sorted into for the lens's rays: 8 × 8 pixels. */
const TILE_SHIFT = 3;
const TILE = 1 << TILE_SHIFT;

/**
 * Panels (surfaces, then flags) as flat numbers: x1, y1, ex, ey, base, top, unit normal (nx, ny, nz), and for a
 * tilted panel its up edge (vx, vy, vz) with `tilted` 1 (upright panels: the plan test with a height range).
 */
const PANEL_STRIDE = 12;
type Panels = { count: number; data: Float64Array; transmission: Float64Array; tilted: Uint8Array };
function buildPanels(scene: FrameScene['scene']): Panels {
  const list = [
    ...scene.surfaces.map((s) => ({ x1: s.x1, y1: s.y1, x2: s.x2, y2: s.y2, base: s.baseM, top: s.topM, tr: 0, tilt: s.tiltDeg })),
    ...scene.flags.map((s) => ({ x1: s.x1, y1: s.y1, x2: s.x2, y2: s.y2, base: s.baseM ?? 0, top: s.topM ?? 2.5, tr: s.transmission, tilt: s.baseM !== undefined && s.topM !== undefined ? s.tiltDeg : 0 })),
  ];
  const data = new Float64Array(list.length * PANEL_STRIDE);
  const transmission = new Float64Array(list.length);
  const tilted = new Uint8Array(list.length);
  list.forEach((q, i) => {
    const f = panelFrame({ x1: q.x1, y1: q.y1, x2: q.x2, y2: q.y2, baseM: q.base, topM: q.top, tiltDeg: q.tilt });
    data.set([q.x1, q.y1, f.ex, f.ey, q.base, f.tilted ? q.base + f.vz : q.top, f.nx, f.ny, f.nz, f.vx, f.vy, f.vz], i * PANEL_STRIDE);
    transmission[i] = q.tr;
    tilted[i] = f.tilted ? 1 : 0;
  });
  return { count: list.length, data, transmission, tilted };
}

/** Where ray o + t·d meets panel i, t in (1e-6, best), or −1. */
function hitPanel(P: Float64Array, i: number, tilted: boolean, ox: number, oy: number, oz: number, dx: number, dy: number, dz: number, best: number): number {
  const k = i * PANEL_STRIDE;
  const ex = P[k + 2]!;
  const ey = P[k + 3]!;
  if (tilted) {
    // The parallelogram A + s·E + w·V: meet its plane, then its two edge coordinates (E ⟂ V).
    const nx = P[k + 6]!;
    const ny = P[k + 7]!;
    const nz = P[k + 8]!;
    const den = dx * nx + dy * ny + dz * nz;
    if (den === 0) return -1;
    const apx = P[k]! - ox;
    const apy = P[k + 1]! - oy;
    const apz = P[k + 4]! - oz;
    const t = (apx * nx + apy * ny + apz * nz) / den;
    if (t <= 1e-6 || t >= best) return -1;
    const rx = t * dx - apx;
    const ry = t * dy - apy;
    const rz = t * dz - apz;
    const su = (rx * ex + ry * ey) / (ex * ex + ey * ey);
    if (su < 0 || su > 1) return -1;
    const vx = P[k + 9]!;
    const vy = P[k + 10]!;
    const vz = P[k + 11]!;
    const w = (rx * vx + ry * vy + rz * vz) / (vx * vx + vy * vy + vz * vz);
    return w >= 0 && w <= 1 ? t : -1;
  }
  const denom = dx * ey - dy * ex;
  if (denom === 0) return -1;
  const apx = P[k]! - ox;
  const apy = P[k + 1]! - oy;
  const t = (apx * ey - apy * ex) / denom;
  if (t <= 1e-6 || t >= best) return -1;
  const u = (apx * dy - apy * dx) / denom;
  if (u < 0 || u > 1) return -1;
  const z = oz + t * dz;
  if (z < P[k + 4]! || z > P[k + 5]!) return -1;
  return t;
}

/**
 * For each 8 × 8 tile, a bit per part of the form whose bounding sphere can project into it (conservative: the
 * box around the sphere in camera space, projected; a sphere reaching behind the lens covers every tile). Two
 * words per tile: parts 0–31, then 32–63.
 */
function partTileMasks(S: Solids, cam: FrameCamera, W: number, H: number, tilesX: number): Uint32Array {
  const tilesY = (H + TILE - 1) >> TILE_SHIFT;
  const masks = new Uint32Array(tilesX * tilesY * 2);
  for (let i = 0; i < S.count; i++) {
    const vx = S.c[i * 3]! - cam.ox;
    const vy = S.c[i * 3 + 1]! - cam.oy;
    const vz = S.c[i * 3 + 2]! - cam.oz;
    const r = S.pr[i]!;
    const zf = vx * cam.f[0] + vy * cam.f[1] + vz * cam.f[2];
    const xr = vx * cam.r[0] + vy * cam.r[1] + vz * cam.r[2];
    const yu = vx * cam.u[0] + vy * cam.u[1] + vz * cam.u[2];
    let x0 = 0;
    let x1 = tilesX - 1;
    let y0 = 0;
    let y1 = tilesY - 1;
    if (zf - r > 1e-3) {
      const zs = [zf - r, zf + r];
      let lo = Infinity, hi = -Infinity, vlo = Infinity, vhi = -Infinity;
      for (const z of zs)
        for (const sgn of [-1, 1]) {
          lo = Math.min(lo, (xr + sgn * r) / z);
          hi = Math.max(hi, (xr + sgn * r) / z);
          vlo = Math.min(vlo, (yu + sgn * r) / z);
          vhi = Math.max(vhi, (yu + sgn * r) / z);
        }
      const pxLo = (lo / cam.tanH / 2 + 0.5) * W - 1;
      const pxHi = (hi / cam.tanH / 2 + 0.5) * W + 1;
      const pyLo = (0.5 - vhi / cam.tanV / 2) * H - 1;
      const pyHi = (0.5 - vlo / cam.tanV / 2) * H + 1;
      if (pxHi < 0 || pyHi < 0 || pxLo > W || pyLo > H) continue;
      x0 = Math.max(0, Math.floor(pxLo) >> TILE_SHIFT);
      x1 = Math.min(tilesX - 1, Math.floor(pxHi) >> TILE_SHIFT);
      y0 = Math.max(0, Math.floor(pyLo) >> TILE_SHIFT);
      y1 = Math.min(tilesY - 1, Math.floor(pyHi) >> TILE_SHIFT);
    } else if (zf + r <= 0) continue;
    const bit = (1 << (i & 31)) >>> 0;
    const w = i >> 5;
    for (let ty = y0; ty <= y1; ty++) for (let tx = x0; tx <= x1; tx++) masks[(ty * tilesX + tx) * 2 + w] = (masks[(ty * tilesX + tx) * 2 + w]! | bit) >>> 0;
  }
  return masks;
}

type PreparedFrame = {
  fs: FrameScene;
  field: Field;
  solids: Solids | null;
  skin: [number, number, number];
  wb: [number, number, number];
};

/** Everything that does not depend on the picture's size; reuse it for a coarse and a refined pass. */
function prepareFrame(input: FrameInput): PreparedFrame {
  const fs: FrameScene = parseFrameInput(input);
  const field = prepareField(fs.scene);
  const solids = fs.extras.subjectVisible ? buildSubjectSolids(fs.scene.subject, fs.extras.pose) : null;
  const y = SKIN_TONES[fs.extras.skinTone].reflectance;
  const hy = 0.2126 * SKIN_HUE[0] + 0.7152 * SKIN_HUE[1] + 0.0722 * SKIN_HUE[2];
  const skin: [number, number, number] = [(SKIN_HUE[0] * y) / hy, (SKIN_HUE[1] * y) / hy, (SKIN_HUE[2] * y) / hy];
  const w = kelvinToLinearRgb(fs.scene.camera.whiteBalanceK);
  const wb: [number, number, number] = [1 / w[0], 1 / w[1], 1 / w[2]];
  return { fs, field, solids, skin, wb };
}

export function renderFrame(input: FrameInput | PreparedFrame, opts: RenderOptions): FrameResult {
  const p = 'field' in input ? input : prepareFrame(input);
  const { fs, field, solids, skin, wb } = p;
  const scene = fs.scene;
  const W = Math.max(1, Math.min(4096, Math.round(opts.width)));
  const H = frameHeight(fs, W);
  const N = W * H;
  const cam = frameCamera(fs);
  const step = Math.max(1, Math.round(opts.latticeStep ?? 4));
  const boxes = buildBoxes(fs.extras.props);
  const optics = surfaceOptics(scene);
  const floorRgb = surfaceReflectance(fs.extras.floor.colour).rgb;
  const ceiling = fs.extras.ceiling;
  const ceilRgb = ceiling ? surfaceReflectance(ceiling.colour).rgb : floorRgb;
  const propRgb = linearRgbOf(PROP_COLOUR);
  const inv = 1 / field.correctLuxSeconds;
  const amb = field.ambientRgb;

  const linear = new Float32Array(N * 3);
  const stops = new Float32Array(N);
  const ids = new Int32Array(N);
  // What each pixel's ray hits: point, normal, albedo, what a scrim in the view lets through, material.
  const { hitP, hitN, alb, see, mats } = scratchFor(N);

  const n = new Float64Array(3);
  const acc = new Float64Array(3);
  const hit = { t: 0, part: 0 };
  const S = solids;
  const nSurf = scene.surfaces.length;
  const panels = buildPanels(scene);
  // Which of the form's parts can be seen in each 8 × 8 tile of the picture (a bit per part), so a ray tests
  // only the parts whose bounding spheres project over its tile.
  const tilesX = (W + TILE - 1) >> TILE_SHIFT;
  const tileMasks = S ? partTileMasks(S, cam, W, H, tilesX) : null;

  // Pass 1: one ray per pixel through the lens.
  for (let py = 0; py < H; py++) {
    const v = (0.5 - (py + 0.5) / H) * 2 * cam.tanV;
    for (let px = 0; px < W; px++) {
      const hx = ((px + 0.5) / W - 0.5) * 2 * cam.tanH;
      let dx = cam.f[0] + cam.r[0] * hx + cam.u[0] * v;
      let dy = cam.f[1] + cam.r[1] * hx + cam.u[1] * v;
      let dz = cam.f[2] + cam.r[2] * hx + cam.u[2] * v;
      const dl = Math.sqrt(dx * dx + dy * dy + dz * dz);
      dx /= dl;
      dy /= dl;
      dz /= dl;
      const ox = cam.ox;
      const oy = cam.oy;
      const oz = cam.oz;
      let best = Infinity;
      let id = ID_VOID;
      let ar = 0;
      let ag = 0;
      let ab = 0;
      let mat = 0;
      let transmit = 1;
      // Floor and ceiling.
      if (dz < 0) {
        const t = -oz / dz;
        if (t > 0 && t < best) {
          best = t;
          id = ID_FLOOR;
          n[0] = 0;
          n[1] = 0;
          n[2] = 1;
        }
      } else if (ceiling && dz > 0) {
        const t = (ceiling.heightM - oz) / dz;
        if (t > 0 && t < best) {
          best = t;
          id = ID_CEILING;
          n[0] = 0;
          n[1] = 0;
          n[2] = -1;
        }
      }
      // Walls, backdrops, reflectors, v-flats, then flags: vertical panels, two-sided. Opaque flags are seen
      // (near-black); scrims pass the view through at their transmission.
      let panel = -1;
      for (let i = 0; i < panels.count; i++) {
        const t = hitPanel(panels.data, i, panels.tilted[i] === 1, ox, oy, oz, dx, dy, dz, best);
        if (t < 0) continue;
        const tr = panels.transmission[i]!;
        if (tr > 0) {
          transmit *= tr;
          continue;
        }
        best = t;
        panel = i;
      }
      if (panel >= 0) {
        const k = panel * PANEL_STRIDE;
        let nx = panels.data[k + 6]!;
        let ny = panels.data[k + 7]!;
        let nz = panels.data[k + 8]!;
        const front = nx * dx + ny * dy + nz * dz < 0;
        if (!front) {
          nx = -nx;
          ny = -ny;
          nz = -nz;
        }
        n[0] = nx;
        n[1] = ny;
        n[2] = nz;
        if (panel < nSurf) {
          id = ID_SURFACE + panel;
          const side = front ? optics[panel]!.front : optics[panel]!.back;
          ar = side.rgb[0];
          ag = side.rgb[1];
          ab = side.rgb[2];
        } else {
          id = ID_FLAG + panel - nSurf;
          ar = ag = ab = FLAG_REFLECTANCE;
        }
      }
      if (boxes.count > 0) {
        const tb = hitBoxes(boxes, ox, oy, oz, dx, dy, dz, best, acc);
        if (tb < best) {
          best = tb;
          id = ID_PROP;
          n[0] = acc[0]!;
          n[1] = acc[1]!;
          n[2] = acc[2]!;
          ar = propRgb[0];
          ag = propRgb[1];
          ab = propRgb[2];
        }
      }
      const ti = ((py >> TILE_SHIFT) * tilesX + (px >> TILE_SHIFT)) * 2;
      const tileMask = tileMasks ? tileMasks[ti]! : 0;
      const tileMaskHi = tileMasks ? tileMasks[ti + 1]! : 0;
      if (S && (tileMask !== 0 || tileMaskHi !== 0) && hitSolids(S, ox, oy, oz, dx, dy, dz, 1e-6, best, hit, tileMask, tileMaskHi)) {
        best = hit.t;
        id = ID_SUBJECT;
        mat = S.mat[hit.part]!;
        solidNormal(S, hit.part, ox + dx * best, oy + dy * best, oz + dz * best, n);
        if (mat === CLOTH) ar = ag = ab = CLOTH_REFLECTANCE;
        else if (mat === EYE) ar = ag = ab = EYE_REFLECTANCE;
        else {
          ar = skin[0];
          ag = skin[1];
          ab = skin[2];
        }
      }
      const pi = py * W + px;
      ids[pi] = id;
      if (id === ID_FLOOR) {
        ar = floorRgb[0];
        ag = floorRgb[1];
        ab = floorRgb[2];
      } else if (id === ID_CEILING) {
        ar = ceilRgb[0];
        ag = ceilRgb[1];
        ab = ceilRgb[2];
      }
      if (id === ID_VOID) continue;
      hitP[pi * 3] = ox + dx * best;
      hitP[pi * 3 + 1] = oy + dy * best;
      hitP[pi * 3 + 2] = oz + dz * best;
      hitN[pi * 3] = n[0]!;
      hitN[pi * 3 + 1] = n[1]!;
      hitN[pi * 3 + 2] = n[2]!;
      alb[pi * 3] = ar;
      alb[pi * 3 + 1] = ag;
      alb[pi * 3 + 2] = ab;
      see[pi] = transmit;
      mats[pi] = mat;
    }
  }

  // The light at a pixel's hit point, split in two: `direct` (ambient and every light: hard shadows, beam
  // edges, the form's own shadows from area sources) and `smooth` (the bounce off the room's patches).
  const rec: Receptor = { x: 0, y: 0, z: 0, nx: 0, ny: 0, nz: 1 };
  const shadow = S
    ? (L: RoomLight, r: Receptor): number => solidsClear(S, r.x + r.nx * 2e-3, r.y + r.ny * 2e-3, r.z + r.nz * 2e-3, L.px, L.py, L.pz)
    : undefined;
  const withSmooth = field.room.coarse.count > 0;
  const at = (pi: number) => {
    rec.x = hitP[pi * 3]!;
    rec.y = hitP[pi * 3 + 1]!;
    rec.z = hitP[pi * 3 + 2]!;
    rec.nx = hitN[pi * 3]!;
    rec.ny = hitN[pi * 3 + 1]!;
    rec.nz = hitN[pi * 3 + 2]!;
  };
  const direct = (pi: number, out: Float64Array, o: number) => {
    at(pi);
    tmp[0] = amb[0];
    tmp[1] = amb[1];
    tmp[2] = amb[2];
    directInto(field, rec, tmp, ids[pi] === ID_SUBJECT, shadow, 'all');
    out[o] = tmp[0]!;
    out[o + 1] = tmp[1]!;
    out[o + 2] = tmp[2]!;
  };
  const smooth = (pi: number, out: Float64Array, o: number) => {
    tmp[0] = tmp[1] = tmp[2] = 0;
    if (withSmooth) {
      at(pi);
      bounceInto(field, rec, tmp, ids[pi] === ID_SUBJECT, 1);
    }
    out[o] = tmp[0]!;
    out[o + 1] = tmp[1]!;
    out[o + 2] = tmp[2]!;
  };
  const tmp = new Float64Array(3);

  // Pass 2: the bounce on a lattice of every 2·`step`-th pixel (and the last row and column), eagerly; the
  // direct light on lattices of `step`, `step`/2, … 2 pixels, each point computed when a pixel first asks.
  const levels = N <= 1_000_000 ? latticeLevels(W, H, step) : latticeLevels(W, H, step, false);
  const top = levels[0];
  // The bounce is smooth within an object: its lattice is twice the direct light's top one.
  const bstep = step * 2;
  const LX = top ? Math.ceil((W - 1) / bstep) + 1 : 1;
  const LY = top ? Math.ceil((H - 1) / bstep) + 1 : 1;
  const latS = new Float64Array(LX * LY * 3);
  if (top && withSmooth)
    for (let j = 0; j < LY; j++)
      for (let k = 0; k < LX; k++) {
        const pi = Math.min(j * bstep, H - 1) * W + Math.min(k * bstep, W - 1);
        if (ids[pi] !== ID_VOID) smooth(pi, latS, (j * LX + k) * 3);
      }
  const latPoint = (v: LatticeLevel, k: number, j: number): number => {
    const li = j * v.LX + k;
    if (!v.done[li]) {
      v.done[li] = 1;
      const pi = Math.min(j * v.s, H - 1) * W + Math.min(k * v.s, W - 1);
      if (ids[pi] !== ID_VOID) direct(pi, v.D, li * 3);
    }
    return li;
  };
  /**
   * Whether a lattice cell (top-left corner k, j) can be interpolated: its four corners see one object (kept in
   * `cellId`) and their direct light agrees within DIRECT_SPREAD. Decided once per cell, when a pixel first asks.
   */
  const floor = field.correctLuxSeconds * DIRECT_FLOOR;
  const agree = (lo: number, hi: number, s: number) => hi <= lo * (s <= 2 ? FINE_SPREAD : s <= 4 ? MID_SPREAD : DIRECT_SPREAD) || hi - lo <= floor;
  const cellOk = (v: LatticeLevel, k: number, j: number): boolean => {
    const ci = j * v.LX + k;
    const state = v.state[ci]!;
    if (state !== 0) return state === 1;
    const s = v.s;
    const x0 = k * s;
    const x1 = Math.min(x0 + s, W - 1);
    const y0 = j * s;
    const y1 = Math.min(y0 + s, H - 1);
    const id = ids[y0 * W + x0]!;
    let ok = id !== ID_VOID && ids[y0 * W + x1] === id && ids[y1 * W + x0] === id && ids[y1 * W + x1] === id;
    if (ok) {
      const D = v.D;
      const a = latPoint(v, k, j) * 3;
      const b = latPoint(v, k + 1, j) * 3;
      const c = latPoint(v, k, j + 1) * 3;
      const e = latPoint(v, k + 1, j + 1) * 3;
      const ya = 0.2126 * D[a]! + 0.7152 * D[a + 1]! + 0.0722 * D[a + 2]!;
      const yb = 0.2126 * D[b]! + 0.7152 * D[b + 1]! + 0.0722 * D[b + 2]!;
      const yc = 0.2126 * D[c]! + 0.7152 * D[c + 1]! + 0.0722 * D[c + 2]!;
      const ye = 0.2126 * D[e]! + 0.7152 * D[e + 1]! + 0.0722 * D[e + 2]!;
      ok = agree(Math.min(ya, yb, yc, ye), Math.max(ya, yb, yc, ye), s);
    }
    v.state[ci] = ok ? 1 : 2;
    v.cellId[ci] = id;
    return ok;
  };
  /**
   * The direct light at a pixel: from the coarsest lattice whose cell around it sees one object and agrees; on
   * the finest lattice, beside an object's edge, from the corners that see the pixel's object when they agree;
   * else computed for the pixel itself (and always in the eyes, for the catchlights' shadows).
   */
  const directAt = (px: number, py: number, pi: number, id: number, out: Float64Array) => {
    if (mats[pi] !== EYE) {
      for (let li = 0; li < levels.length; li++) {
        const v = levels[li]!;
        const s = v.s;
        const k = Math.min(Math.floor(px / s), v.LX - 2);
        const j = Math.min(Math.floor(py / s), v.LY - 2);
        const x0 = k * s;
        const x1 = Math.min(x0 + s, W - 1);
        const y0 = j * s;
        const y1 = Math.min(y0 + s, H - 1);
        const fx = x1 > x0 ? (px - x0) / (x1 - x0) : 0;
        const fy = y1 > y0 ? (py - y0) / (y1 - y0) : 0;
        if (cellOk(v, k, j)) {
          if (v.cellId[j * v.LX + k] !== id) continue;
          blend(v, k, j, fx, fy, 15, out);
          return;
        }
        // The finest lattice beside an edge: the corners that see this pixel's object (not on the form's
        // outline, where a light from behind grazes it in a rim thinner than a cell).
        if (li !== levels.length - 1 || id === ID_SUBJECT) continue;
        const m = (ids[y0 * W + x0] === id ? 1 : 0) | (ids[y0 * W + x1] === id ? 2 : 0) | (ids[y1 * W + x0] === id ? 4 : 0) | (ids[y1 * W + x1] === id ? 8 : 0);
        if (m === 0 || m === 15) break;
        if (blend(v, k, j, fx, fy, m, out)) return;
      }
    }
    direct(pi, out, 0);
  };
  /**
   * Bilinear blend of the corners of cell (k, j) picked by `m` (bits: top-left, top-right, bottom-left,
   * bottom-right), weights renormalised; false when the picked corners disagree beyond DIRECT_SPREAD.
   */
  const blend = (v: LatticeLevel, k: number, j: number, fx: number, fy: number, m: number, out: Float64Array): boolean => {
    const D = v.D;
    let lo = Infinity;
    let hi = 0;
    let wsum = 0;
    out[0] = out[1] = out[2] = 0;
    for (let q = 0; q < 4; q++) {
      if (!(m & (1 << q))) continue;
      const dk = q & 1;
      const dj = q >> 1;
      const w = (dk ? fx : 1 - fx) * (dj ? fy : 1 - fy);
      const o = latPoint(v, k + dk, j + dj) * 3;
      if (m !== 15) {
        const y = 0.2126 * D[o]! + 0.7152 * D[o + 1]! + 0.0722 * D[o + 2]!;
        if (y < lo) lo = y;
        if (y > hi) hi = y;
      }
      out[0] += w * D[o]!;
      out[1] += w * D[o + 1]!;
      out[2] += w * D[o + 2]!;
      wsum += w;
    }
    if (m === 15) return true;
    if (!agree(lo, hi, v.s) || wsum < 1e-6) return false;
    out[0] /= wsum;
    out[1] /= wsum;
    out[2] /= wsum;
    return true;
  };

  // Pass 3: every pixel. Between four lattice points that see the same object the bounce is interpolated;
  // beside an object's edge it is taken from a corner that sees the same object, or computed once per cell.
  const cellAltId = new Int32Array(LX * LY).fill(-2);
  const cellAlt = new Float64Array(LX * LY * 3);
  const d = new Float64Array(3);
  const sm = new Float64Array(3);
  for (let py = 0; py < H; py++) {
    const j = LY > 1 ? Math.min(Math.floor(py / bstep), LY - 2) : 0;
    const y0 = Math.min(j * bstep, H - 1);
    const y1 = LY > 1 ? Math.min(y0 + bstep, H - 1) : y0;
    const fy = y1 > y0 ? (py - y0) / (y1 - y0) : 0;
    for (let px = 0; px < W; px++) {
      const pi = py * W + px;
      const id = ids[pi]!;
      if (id === ID_VOID) {
        stops[pi] = NaN;
        continue;
      }
      const mat = mats[pi]!;
      directAt(px, py, pi, id, d);
      if (!withSmooth) sm[0] = sm[1] = sm[2] = 0;
      else if (!top) smooth(pi, sm, 0);
      else {
        const k = LX > 1 ? Math.min(Math.floor(px / bstep), LX - 2) : 0;
        const x0 = Math.min(k * bstep, W - 1);
        const x1 = LX > 1 ? Math.min(x0 + bstep, W - 1) : x0;
        const fx = x1 > x0 ? (px - x0) / (x1 - x0) : 0;
        const a = j * LX + k;
        const b = LX > 1 ? a + 1 : a;
        const c = LY > 1 ? a + LX : a;
        const e = LX > 1 ? c + 1 : c;
        const ia = ids[y0 * W + x0];
        const ib = ids[y0 * W + x1];
        const ic = ids[y1 * W + x0];
        const ie = ids[y1 * W + x1];
        if (ia === id && ib === id && ic === id && ie === id) {
          const wa = (1 - fx) * (1 - fy);
          const wb2 = fx * (1 - fy);
          const wc = (1 - fx) * fy;
          const we = fx * fy;
          for (let q = 0; q < 3; q++) sm[q] = wa * latS[a * 3 + q]! + wb2 * latS[b * 3 + q]! + wc * latS[c * 3 + q]! + we * latS[e * 3 + q]!;
        } else {
          const from = ia === id ? a : ib === id ? b : ic === id ? c : ie === id ? e : -1;
          if (from >= 0) for (let q = 0; q < 3; q++) sm[q] = latS[from * 3 + q]!;
          else if (cellAltId[a] === id) for (let q = 0; q < 3; q++) sm[q] = cellAlt[a * 3 + q]!;
          else {
            smooth(pi, sm, 0);
            if (cellAltId[a] === -2) {
              cellAltId[a] = id;
              for (let q = 0; q < 3; q++) cellAlt[a * 3 + q] = sm[q]!;
            }
          }
        }
      }
      const h0 = d[0]! + sm[0]!;
      const h1 = d[1]! + sm[1]!;
      const h2 = d[2]! + sm[2]!;
      const y = 0.2126 * h0 + 0.7152 * h1 + 0.0722 * h2;
      stops[pi] = y > 0 ? fastLog2(y * inv) : -30;
      let lr = alb[pi * 3]! * h0 * wb[0] * inv;
      let lg = alb[pi * 3 + 1]! * h1 * wb[1] * inv;
      let lb = alb[pi * 3 + 2]! * h2 * wb[2] * inv;
      if (mat === EYE && S) {
        at(pi);
        const hx = rec.x - cam.ox;
        const hy = rec.y - cam.oy;
        const hz = rec.z - cam.oz;
        const hl = Math.hypot(hx, hy, hz) || 1;
        const spec = catchlight(field, S, rec, hx / hl, hy / hl, hz / hl, shadow!);
        lr += spec[0] * wb[0] * inv;
        lg += spec[1] * wb[1] * inv;
        lb += spec[2] * wb[2] * inv;
      }
      const t = see[pi]!;
      linear[pi * 3] = lr * t;
      linear[pi * 3 + 1] = lg * t;
      linear[pi * 3 + 2] = lb * t;
    }
  }

  const sub = scene.subject;
  const subjectH = exposureAt(field, { x: sub.x, y: sub.y, z: sub.heightM, nx: Math.cos((sub.facingDeg * Math.PI) / 180), ny: Math.sin((sub.facingDeg * Math.PI) / 180), nz: 0 }, true);
  const subjH = subjectH.luxSeconds + 0.2126 * amb[0] + 0.7152 * amb[1] + 0.0722 * amb[2];
  return { width: W, height: H, linear, stops, ids, subjectStops: subjH > 0 ? Math.log2(subjH * inv) : null, camera: cam };
}

/** log2 by exponent and a 1024-step table of the mantissa, linearly interpolated (error under 1e-6). */
const LOG2_STEPS = 1024;
const LOG2_TABLE = Float64Array.from({ length: LOG2_STEPS + 1 }, (_, i) => Math.log2(1 + i / LOG2_STEPS));
const f64 = new Float64Array(1);
const u32 = new Uint32Array(f64.buffer);
/** Which 32-bit half of a float64 holds the sign, exponent and the mantissa's top (1 on little-endian machines). */
const HI = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;
function fastLog2(x: number): number {
  if (!(x >= 1e-300) || x === Infinity) return Math.log2(x);
  f64[0] = x;
  const hi = u32[HI]!;
  const e = (hi >>> 20) - 1023;
  if (e === -1023) return Math.log2(x); // subnormal
  const frac = ((hi & 0xfffff) + u32[1 - HI]! / 4294967296) / 1048576; // mantissa − 1, in [0, 1)
  const t = frac * LOG2_STEPS;
  const i = t | 0;
  return e + LOG2_TABLE[i]! + (t - i) * (LOG2_TABLE[i + 1]! - LOG2_TABLE[i]!);
}

const specOut: [number, number, number] = [0, 0, 0];
/**
 * Mirror reflection of each light in the cornea (the only specular surface in the frame): where the view ray
 * reflected about the eye's normal points into a light's face, the pixel receives ρ_cornea·π·L_light, with the
 * light's face luminance L = I·p(θ)/(πR²) (cd·s/m²) — in the same units as ρ·H for a diffuse surface.
 */
function catchlight(field: Field, S: Solids, r: Receptor, dx: number, dy: number, dz: number, shadow: (L: RoomLight, r: Receptor) => number): [number, number, number] {
  specOut[0] = specOut[1] = specOut[2] = 0;
  const dn = dx * r.nx + dy * r.ny + dz * r.nz;
  const rx = dx - 2 * dn * r.nx;
  const ry = dy - 2 * dn * r.ny;
  const rz = dz - 2 * dn * r.nz;
  for (const L of field.lights) {
    if (L.axialCdS <= 0) continue;
    const lx = L.px - r.x;
    const ly = L.py - r.y;
    const lz = L.pz - r.z;
    const d = Math.hypot(lx, ly, lz);
    if (d < 1e-6) continue;
    const cosA = (rx * lx + ry * ly + rz * lz) / d;
    const R = Math.max(0.04, Math.sqrt(L.faceR2));
    const alpha = Math.max(MIN_CATCHLIGHT_RAD, Math.atan(R / d));
    if (cosA < Math.cos(alpha)) continue;
    // Facing the light's front only: the beam must point back at the eye.
    const cosOff = -(lx * L.ax + ly * L.ay + lz * L.az) / d;
    if (cosOff <= 0) continue;
    if (shadow(L, r) === 0) continue;
    const lum = (L.axialCdS * cosOff) / (Math.PI * R * R);
    const v = CORNEA_REFLECTANCE * Math.PI * lum;
    specOut[0] += v * L.rgb[0];
    specOut[1] += v * L.rgb[1];
    specOut[2] += v * L.rgb[2];
  }
  void S;
  return specOut;
}
