// The plan the editor's drag bench and profile drag on: forty items with eight lights round a subject.
import { parseDocument } from '../../model/document';

export function fortyItems() {
  const items: unknown[] = [
    { id: 'sub', kind: 'subject', x: 5, y: 4, facingDeg: 90 },
    { id: 'cam', kind: 'camera', x: 5, y: 7.5, aimDeg: -90 },
  ];
  const walls = [
    [0.5, 0.5, 9.5, 0.5],
    [9.5, 0.5, 9.5, 7.5],
    [0.5, 0.5, 0.5, 7.5],
    [2, 1.2, 8, 1.2],
    [0.5, 7.5, 3, 7.5],
    [7, 7.5, 9.5, 7.5],
  ];
  walls.forEach(([x1, y1, x2, y2], k) => items.push({ id: `w${k}`, kind: 'wall', a: { x: x1, y: y1 }, b: { x: x2, y: y2 }, colour: k === 3 ? '#8a8d90' : '#d9d6cf' }));
  for (let k = 0; k < 8; k++) {
    const a = (k / 8) * 2 * Math.PI;
    const x = 5 + Math.cos(a) * 2.5;
    const y = 4 + Math.sin(a) * 2;
    items.push({ id: `l${k}`, kind: 'light', label: `Light ${k + 1}`, x, y, aimDeg: (Math.atan2(4 - y, 5 - x) * 180) / Math.PI, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: k % 2 ? 'softbox' : 'grid-20' });
  }
  for (let k = 0; k < 4; k++) items.push({ id: `f${k}`, kind: 'flag', x: 2 + k * 2, y: 6, rotationDeg: -90 });
  for (let k = 0; k < 6; k++) items.push({ id: `r${k}`, kind: k % 2 ? 'reflector' : 'vflat', x: 1.5 + k * 1.4, y: 2.2, rotationDeg: 90 });
  for (let k = 0; k < 8; k++) items.push(k % 2 ? { id: `p${k}`, kind: 'prop', x: 1 + k, y: 6.8 } : { id: `p${k}`, kind: 'note', x: 1 + k, y: 6.8, text: `note ${k}` });
  while (items.length < 40) items.push({ id: `t${items.length}`, kind: 'tape', a: { x: 1, y: 3 + items.length * 0.05 }, b: { x: 3, y: 3 + items.length * 0.05 } });
  return parseDocument({ schemaVersion: 1, stage: { widthM: 10, depthM: 8 }, items });
}
