// The light map's tint on the web: a small <canvas> with one pixel per map point, scaled by CSS under the
// plan's SVG. Painting it is a putImageData per change — no image encoding — so it keeps up with a drag.
import { createElement, useEffect, useRef } from 'react';
import type { LightMapResult } from '../../calc';
import type { Camera } from '../editor/camera';
import { RAMP_MIN, RAMP_STEPS_PER_STOP, rampTable } from './ramp';

export function HeatCanvas({ map, view }: { map: LightMapResult; view: Camera }) {
  const ref = useRef<HTMLCanvasElement | null>(null);
  useEffect(() => {
    const c = ref.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    if (c.width !== map.nx || c.height !== map.ny) {
      c.width = map.nx;
      c.height = map.ny;
    }
    const img = ctx.createImageData(map.nx, map.ny);
    const data = img.data;
    const stops = map.stops;
    const last = rampTable.length / 4 - 1;
    for (let k = 0; k < stops.length; k++) {
      const j = Math.min(last, Math.max(0, Math.round((stops[k]! - RAMP_MIN) * RAMP_STEPS_PER_STOP))) * 4;
      data[k * 4] = rampTable[j]!;
      data[k * 4 + 1] = rampTable[j + 1]!;
      data[k * 4 + 2] = rampTable[j + 2]!;
      data[k * 4 + 3] = rampTable[j + 3]!;
    }
    ctx.putImageData(img, 0, 0);
  }, [map]);
  // Each value is a grid point; the pixels are centred on them.
  const left = view.tx + (map.x0 - map.dxM / 2) * view.scale;
  const top = view.ty + (map.y0 - map.dyM / 2) * view.scale;
  const width = (map.x1 - map.x0 + map.dxM) * view.scale;
  const height = (map.y1 - map.y0 + map.dyM) * view.scale;
  return createElement('canvas', {
    ref,
    'aria-hidden': true,
    style: { position: 'absolute', left, top, width, height, opacity: 0.9, pointerEvents: 'none' },
  });
}
