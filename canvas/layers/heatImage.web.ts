// Paints the light map (stops relative to the subject) into a small bitmap for the plan's background.
import type { LightMapResult } from '../../calc';
import { stopsColour } from './ramp';

let canvas: HTMLCanvasElement | null = null;

export function heatImageUri(map: LightMapResult): string | null {
  if (typeof document === 'undefined') return null;
  canvas ??= document.createElement('canvas');
  canvas.width = map.nx;
  canvas.height = map.ny;
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  const img = ctx.createImageData(map.nx, map.ny);
  for (let k = 0; k < map.stops.length; k++) {
    const [r, g, b, a] = stopsColour(map.stops[k]!);
    img.data[k * 4] = r;
    img.data[k * 4 + 1] = g;
    img.data[k * 4 + 2] = b;
    img.data[k * 4 + 3] = a;
  }
  ctx.putImageData(img, 0, 0);
  return canvas.toDataURL('image/png');
}
