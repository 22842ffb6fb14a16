// Three demo setups of our own invention, as plain documents (parsed with the shared schema on insert).
// Stage: 8 m × 6 m; the camera sits near the bottom of the plan and looks up the screen (aim −90°).
import type { SetupDocument } from '../model/document';
import { CURRENT_SCHEMA_VERSION, parseDocument } from '../model/document';

const stage = { widthM: 8, depthM: 6 };

const clamshell = {
  schemaVersion: CURRENT_SCHEMA_VERSION,
  stage,
  ambientEv100: null,
  targetAperture: 8,
  items: [
    { id: 'backdrop', kind: 'wall', label: 'Grey seamless', surface: 'seamless', a: { x: 2.2, y: 1.2 }, b: { x: 5.8, y: 1.2 }, heightM: 2.7, colour: '#8a8d90' },
    { id: 'sitter', kind: 'subject', label: 'Sitter', x: 4, y: 3.2, facingDeg: 90, faceHeightM: 1.25, pose: 'seated' },
    { id: 'stool', kind: 'prop', label: 'Posing stool', shape: 'stool', x: 4, y: 3.1 },
    { id: 'key', kind: 'light', label: 'Key — octa above', x: 4, y: 4.1, heightM: 2.1, aimDeg: -90, tiltDeg: -40, source: { type: 'strobe', energyWs: 500 }, power: 1 / 8, modifier: 'octa', role: 'key', stand: 'boom', sandbagged: true },
    { id: 'under', kind: 'reflector', label: 'Silver under the chin', x: 4, y: 3.75, rotationDeg: -90, widthM: 0.8, heightM: 0.6, baseM: 0.65, tiltDeg: 45, finish: 'silver' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.4, heightM: 1.3, aimDeg: -90, focalMm: 85, iso: 100, aperture: 8, shutterS: 1 / 160 },
    { id: 'tape1', kind: 'tape', a: { x: 4, y: 3.2 }, b: { x: 4, y: 1.2 } },
  ],
  steps: [
    { id: 's1', title: 'Key alone', note: 'Boom the octa just above the eye line, feathered down onto the face.', itemIds: ['backdrop', 'sitter', 'stool', 'cam', 'key'] },
    { id: 's2', title: 'Fill from below', note: 'Slide the silver panel in under the chin until the eye sockets open up.', itemIds: ['under'] },
  ],
  shots: [
    { id: 'sh1', framing: 'medium', focalMm: 85, aperture: 8, shutterS: 1 / 160, iso: 100, note: 'Head and shoulders' },
    { id: 'sh2', framing: 'tight', focalMm: 105, aperture: 8, shutterS: 1 / 160, iso: 100, note: 'Eyes and mouth' },
  ],
};

const twinRims = {
  schemaVersion: CURRENT_SCHEMA_VERSION,
  stage,
  ambientEv100: null,
  targetAperture: 11,
  items: [
    { id: 'black', kind: 'wall', label: 'Black seamless', surface: 'seamless', a: { x: 1.8, y: 0.8 }, b: { x: 6.2, y: 0.8 }, heightM: 2.7, colour: '#151515' },
    { id: 'runner', kind: 'subject', label: 'Runner', x: 4, y: 2.8, facingDeg: 90, faceHeightM: 1.7 },
    { id: 'rimL', kind: 'light', label: 'Rim left', x: 2.7, y: 2.0, heightM: 1.8, aimDeg: 31, tiltDeg: -3, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'strip', gridDeg: 40, role: 'rim' },
    { id: 'rimR', kind: 'light', label: 'Rim right', x: 5.3, y: 2.0, heightM: 1.8, aimDeg: 149, tiltDeg: -3, source: { type: 'strobe', energyWs: 400 }, power: 1 / 4, modifier: 'strip', gridDeg: 40, role: 'rim' },
    { id: 'dish', kind: 'light', label: 'Key — dish', x: 3.2, y: 4.0, heightM: 2.2, aimDeg: -56, tiltDeg: -25, source: { type: 'strobe', energyWs: 500 }, power: 2 ** -2.7, modifier: 'beauty-dish', role: 'key', stand: 'boom' },
    { id: 'flagL', kind: 'flag', label: 'Flag off the lens', x: 2.9, y: 2.5, rotationDeg: 90, widthM: 0.6, heightM: 0.9 },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.5, heightM: 1.4, aimDeg: -90, focalMm: 70, iso: 100, aperture: 11, shutterS: 1 / 200 },
  ],
  steps: [
    { id: 's1', title: 'Rims first', note: 'Set both strips behind the runner and check for even edges on each side.', itemIds: ['black', 'runner', 'rimL', 'rimR', 'flagL', 'cam'] },
    { id: 's2', title: 'Add the key', note: 'Bring in the dish high and camera left; keep it off the black paper.', itemIds: ['dish'] },
  ],
  shots: [{ id: 'sh1', framing: 'wide', focalMm: 35, aperture: 11, shutterS: 1 / 200, iso: 100, note: 'Full length, mid-stride' }],
};

const tealWarm = {
  schemaVersion: CURRENT_SCHEMA_VERSION,
  stage,
  ambientEv100: 7,
  targetAperture: 5.6,
  items: [
    { id: 'paper', kind: 'wall', label: 'White seamless', surface: 'seamless', a: { x: 1.6, y: 1.0 }, b: { x: 6.4, y: 1.0 }, heightM: 2.7, colour: '#f2f0ea' },
    { id: 'wallR', kind: 'wall', label: 'Studio wall', a: { x: 7.6, y: 0.4 }, b: { x: 7.6, y: 5.6 }, heightM: 3.2, colour: '#c9c2b4' },
    { id: 'singer', kind: 'subject', label: 'Singer', x: 4, y: 3.0, facingDeg: 100, faceHeightM: 1.65 },
    { id: 'key', kind: 'light', label: 'Key — warm softbox', x: 2.9, y: 4.0, heightM: 1.9, aimDeg: -42, tiltDeg: -12, source: { type: 'strobe', energyWs: 600 }, power: 1 / 32, modifier: 'softbox', gel: 'quarter-cto', role: 'key' },
    { id: 'bg', kind: 'light', label: 'Background — teal', x: 4.2, y: 2.1, heightM: 0.4, aimDeg: -90, tiltDeg: 20, source: { type: 'speedlight', guideNumberM: 42 }, power: 1 / 2, modifier: 'bare-reflector', gel: 'teal', role: 'background', stand: 'floor' },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 4.3, y: 5.5, heightM: 1.6, aimDeg: -95, focalMm: 50, iso: 200, aperture: 5.6, shutterS: 1 / 200 },
    { id: 'n1', kind: 'note', x: 0.3, y: 5.7, text: 'Practicals off; window blinds half down' },
  ],
  steps: [
    { id: 's1', title: 'Ambient check', note: 'Meter the room with the modelling lamps off; it should sit at least 3 stops under.', itemIds: ['paper', 'wallR', 'singer', 'cam', 'n1'] },
    { id: 's2', title: 'Teal wash', note: 'Speedlight on the floor behind the singer, gelled teal, aimed up at the paper.', itemIds: ['bg'] },
    { id: 's3', title: 'Warm key', note: 'Quarter CTO on the softbox so the skin stays warm against the teal.', itemIds: ['key'] },
  ],
  shots: [
    { id: 'sh1', framing: 'wide', focalMm: 35, aperture: 5.6, shutterS: 1 / 200, iso: 200, note: 'Show the whole glow' },
    { id: 'sh2', framing: 'medium', focalMm: 50, aperture: 5.6, shutterS: 1 / 200, iso: 200, note: '' },
  ],
};

export const demoSetups: { title: string; notes: string; tags: string[]; template: boolean; document: SetupDocument }[] = [
  {
    title: 'Clamshell headshot on grey',
    notes: 'Corporate headshots for the Veldt & Mora partners. Keep the grey mid-tone so it prints cleanly.',
    tags: ['headshot', 'beauty', 'one-light'],
    template: false,
    document: parseDocument(clamshell),
  },
  {
    title: 'Twin rims on black for a runner',
    notes: 'Sports campaign test. Strips need grids or the black paper goes grey.',
    tags: ['sport', 'low-key', 'rim'],
    template: false,
    document: parseDocument(twinRims),
  },
  {
    title: 'Teal backdrop, warm key',
    notes: 'Album portrait. Ambient must stay at least three stops under the key.',
    tags: ['music', 'colour', 'gels'],
    template: true,
    document: parseDocument(tealWarm),
  },
];
