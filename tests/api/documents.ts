// Setup documents of a known size for the API tests and the benchmark (no test-runner imports here).
import { CURRENT_SCHEMA_VERSION, parseDocument, type SetupDocument } from '../../model/document';

/** A valid document (defaults filled in) with a subject, a key light and `notes` note items of `noteChars` characters. */
export function documentWith(notes: number, noteChars = 40, marker = ''): SetupDocument {
  const items: unknown[] = [
    { id: 'subj', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'key', kind: 'light', label: 'Key', x: 3, y: 4, heightM: 2, aimDeg: -45, source: { type: 'strobe', energyWs: 400 }, power: 0.25, modifier: 'softbox' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.5, heightM: 1.5, aimDeg: -90, focalMm: 85, iso: 100, aperture: 8, shutterS: 1 / 160 },
  ];
  for (let i = 0; i < notes; i++) {
    items.push({ id: `n${i}`, kind: 'note', x: (i % 7) + 0.5, y: (i % 5) + 0.5, text: `${marker}${'x'.repeat(Math.max(0, noteChars - marker.length))}` });
  }
  return parseDocument({ schemaVersion: CURRENT_SCHEMA_VERSION, stage: { widthM: 8, depthM: 6 }, items, targetAperture: 8 });
}
