// A crew sheet to rig from, over real HTTP: the notes, per light its distances to the subject and the
// background, height in the account's units, aim, power and the expected reading; a rigging checklist in
// step order; the plan on its own page (landscape for a wide set) with its grid in the account's units; a QR
// code of the live plan; and a shoot day's sheets in one PDF behind a cover, in the order chosen.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { crewSheet } from '../../model/crewSheet';
import { parseDocument } from '../../model/document';
import { computeReadings } from '../../model/setupReadings';
import { formatAperture } from '../../model/units';
import { pdfText, raw } from './exports.helpers';
import { fresh, newSetup, studioWithTeam } from './fixtures';

const base = inject('baseUrl');
const clamshell = demoSetups.find((s) => s.title.startsWith('Clamshell'))!;
const twin = demoSetups.find((s) => s.title.startsWith('Twin'))!;

/** A plain room: a backdrop 2 m behind the subject, a key by the camera and a bare strobe 2 m off to her front left at face height. */
const room = parseDocument({
  schemaVersion: 1,
  stage: { widthM: 10, depthM: 5 }, // wider than deep: the plan page turns landscape
  items: [
    { id: 'paper', kind: 'wall', label: 'Paper', surface: 'seamless', a: { x: 2, y: 0.5 }, b: { x: 8, y: 0.5 }, heightM: 2.7, colour: '#808080' },
    { id: 'sitter', kind: 'subject', label: 'Sitter', x: 5, y: 2.5, facingDeg: 90, faceHeightM: 1.6 },
    { id: 'cam', kind: 'camera', label: 'Camera', x: 5, y: 4.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
    { id: 'key', kind: 'light', label: 'Key', x: 5.5, y: 3.8, heightM: 1.9, aimDeg: -110, tiltDeg: -10, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'bare-reflector' },
    { id: 'side', kind: 'light', label: 'Side', x: 3.4, y: 3.7, heightM: 1.6, aimDeg: -7, tiltDeg: 0, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'bare-reflector' },
  ],
});

describe('what the sheet says (model/crewSheet.ts)', () => {
  it('gives distances in the account’s units, aim in the crew’s words, and a flash’s expected reading', () => {
    const readings = computeReadings(room);
    const s = crewSheet(room, { title: 'Room', units: 'metric', readings, notes: '  Call 7:30.  ' });
    expect(s.notes).toBe('Call 7:30.');
    const side = s.lights.find((l) => l.id === 'side')!;
    // Side light at (3.4, 3.7, 1.6 m) and the face at (5, 2.5, 1.6 m): 1.6, 1.2, 0 → 2 m (a 3-4-5 triangle).
    expect(side.toSubject).toBe('2.0 m');
    // The subject lies at −36.9° on the plan from the light; aimed at −7°: 30° off it (both at face height).
    expect(side.aim).toMatch(/^30° off Sitter, level$/);
    const bg = readings.meter!.background!.point;
    expect(side.toBackground).toBe(`${Math.hypot(bg.x - 3.4, bg.y - 3.7, bg.z - 1.6).toFixed(1)} m`);
    const r = readings.meter!.lights.find((l) => l.id === 'side')!;
    expect(side.expected).toBe(formatAperture(r.aperture!));
    const imperial = crewSheet(room, { title: 'Room', units: 'imperial', readings }).lights.find((l) => l.id === 'side')!;
    expect(imperial.toSubject).toBe('6′ 7″'); // 2 m = 78.7 in
    expect(imperial.height).toBe('5′ 3″'); // 1.6 m = 63.0 in
  });

  it('lists the rigging in step order with the checks before the first flash', () => {
    const doc = parseDocument(clamshell.document);
    const s = crewSheet(doc, { title: clamshell.title, units: 'metric' });
    const texts = s.checklist.map((c) => c.text);
    const steps = s.checklist.map((c) => c.step);
    // The first step's items come before the second step's; the checks come last.
    expect(steps.indexOf('2. Fill from below')).toBeGreaterThan(steps.lastIndexOf('1. Key alone'));
    expect(texts.findIndex((t) => t.startsWith('Rig Key'))).toBeLessThan(texts.findIndex((t) => t.includes('Silver under the chin')));
    expect(texts.at(-1)).toBe('Warn the subject before the flashes fire');
    expect(texts.some((t) => t.startsWith('Test-fire and meter at the subject: expect f/'))).toBe(true);
  });
});

describe('the crew sheet PDF', () => {
  let owner: Awaited<ReturnType<typeof fresh>>;
  beforeAll(async () => {
    owner = await fresh(base, 'Sheet Owner');
  });

  it('prints notes, distances, the checklist, the QR caption, and the plan on a landscape page for a wide set', async () => {
    const s = await newSetup(owner.client, { title: 'Wide room sheet', notes: 'Call time 7:30. Bring the long boom.', document: room });
    const r = await raw(base, owner.client, `/api/setups/${s.id}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    const { text, pages } = await pdfText(r.body);
    expect(pages).toBe(2);
    for (const expected of [
      'Call time 7:30. Bring the long boom.',
      '2.0 m to the subject',
      'to the background',
      'reads f/',
      'aim 30° off Sitter, level',
      'Rigging, in order',
      'Rig Side: bare reflector',
      'Warn the subject before the flashes fire',
      'Scan: the live plan (members sign in)',
      'grid 1 m, fine lines every 0.5 m',
    ]) {
      expect(text, expected).toContain(expected);
    }
    // Page 1 portrait A4, page 2 (the plan) landscape A4.
    const boxes = [...r.body.toString('latin1').matchAll(/\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/g)].map((m) => [Number(m[1]!), Number(m[2]!)] as const);
    expect(boxes).toHaveLength(2);
    expect(boxes[0]![0]).toBeLessThan(boxes[0]![1]);
    expect(boxes[1]![0]).toBeGreaterThan(boxes[1]![1]);
  });

  it('uses feet for an imperial account: heights, distances and a 3 ft grid; the share link’s sheet opens without an account', async () => {
    const u = await fresh(base, 'Feet Person');
    expect((await u.client.request('PATCH', '/api/me', { units: 'imperial' })).status).toBe(200);
    const s = await newSetup(u.client, { title: 'Feet sheet', document: room });
    const link = await u.client.post(`/api/setups/${s.id}/shares`, {});
    const r = await raw(base, null, `/api/shared/${link.body.token}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    const { text } = await pdfText(r.body);
    expect(text).toContain('6′ 7″ to the subject');
    expect(text).toContain('height 5′ 3″');
    expect(text).toContain('grid 3 ft, fine lines every 1 ft');
    expect(text).toContain('Scan: the live plan, no account needed');
    expect(text).toContain(link.body.url);
  });
});

describe('POST /api/day-sheet.pdf', () => {
  it('puts the chosen setups in the chosen order behind a cover that lists them with their pages', async () => {
    const team = await studioWithTeam(base);
    const a = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Morning: clamshell', document: clamshell.document });
    const b = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Afternoon: rims', document: twin.document });
    const r = await raw(base, team.crew.client, '/api/day-sheet.pdf', { method: 'POST', body: JSON.stringify({ setupIds: [b.id, a.id], title: 'Track day', date: 'Saturday 14 March' }), headers: { 'content-type': 'application/json' } });
    expect(r.status, r.body.toString()).toBe(200);
    expect(r.type).toBe('application/pdf');
    const { text, pages } = await pdfText(r.body);
    expect(pages).toBeGreaterThanOrEqual(5); // cover + 2 × (sheet + plan)
    expect(text).toContain('Track day');
    expect(text).toContain('Saturday 14 March');
    // The cover lists them in the order chosen, the afternoon first, with the page each starts on.
    expect(text.indexOf('1. Afternoon: rims')).toBeGreaterThan(-1);
    expect(text.indexOf('2. Morning: clamshell')).toBeGreaterThan(text.indexOf('1. Afternoon: rims'));
    expect(text).toMatch(/1\. Afternoon: rims page 2/);
  });

  it('refuses an empty list, a repeated setup and a setup the caller cannot read, naming the field', async () => {
    const team = await studioWithTeam(base);
    const mine = await newSetup(team.owner.client, { studioId: team.studioId, title: 'Mine', document: twin.document });
    const other = await fresh(base, 'Other Owner');
    const theirs = await newSetup(other.client, { title: 'Theirs', document: twin.document });
    const post = (body: unknown) => team.owner.client.post('/api/day-sheet.pdf', body);
    const empty = await post({ setupIds: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty('setupIds');
    const twice = await post({ setupIds: [mine.id, mine.id] });
    expect(twice.status).toBe(400);
    const hidden = await post({ setupIds: [mine.id, theirs.id] });
    expect(hidden.status).toBe(404);
    expect(hidden.body.error.fields).toHaveProperty('setupIds.1');
  });
});
