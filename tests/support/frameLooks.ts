// An invented scenario for look 1 of ../shared/looks.md (a gelled wash on a pale wall and a snooted kicker
// from behind), shared by the frame's e2e test and its bench.
import { CURRENT_SCHEMA_VERSION, parseDocument } from '../../model/document';

export const washAndKicker = parseDocument({
  schemaVersion: CURRENT_SCHEMA_VERSION,
  stage: { widthM: 8, depthM: 7 },
  ambientEv100: 8, // the room's own lights stay on
  targetAperture: 8,
  items: [
    { id: 'wall', kind: 'wall', label: 'Pale wall', a: { x: 0.5, y: 1 }, b: { x: 7.5, y: 1 }, heightM: 2.8, colour: '#e4e1da' },
    { id: 'sitter', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.25, pose: 'seated' },
    { id: 'stool', kind: 'prop', label: 'Stool', shape: 'stool', x: 4, y: 2.9 },
    { id: 'wash', kind: 'light', label: 'Blue wash', x: 5.1, y: 2.3, heightM: 0.9, aimDeg: -140, tiltDeg: 18, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'bare-reflector', gel: 'blue', role: 'background' },
    { id: 'kick', kind: 'light', label: 'Kicker — snoot', x: 3.0, y: 2.4, heightM: 1.45, aimDeg: 31, tiltDeg: -10, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'snoot', role: 'rim' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 6.0, heightM: 1.25, aimDeg: -90, focalMm: 85, iso: 100, aperture: 8, shutterS: 1 / 160 },
  ],
});
