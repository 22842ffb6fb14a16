// Crew sheet and plan exports over real HTTP: the PDF is a PDF with real text (kit list, readings, safety
// line), one page in the account's paper size; the PNG decodes at the asked size; the SVG is well-formed XML.
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { DEFER_LINE } from '../../model/crewSheet';
import { STANDING_CAUTIONS } from '../../model/safety';
import type { Client } from '../support/http';
import { pdfText, raw } from './exports.helpers';
import { demoSetups } from '../../db/seed-setups';
import { fresh, newSetup } from './fixtures';

const base = inject('baseUrl');

const bytes = (c: Client, path: string) => raw(base, c, path);

let owner: Client;
let setupId: string;

/** The demo clamshell plan (db/seed-setups.ts), in a setup of this test's own. */
const clamshell = demoSetups.find((s) => s.title.startsWith('Clamshell'))!.document;

beforeAll(async () => {
  owner = (await fresh(base, 'Export Owner')).client;
  setupId = (await newSetup(owner, { title: 'Export check: clamshell', document: clamshell })).id;
});

describe('GET /api/setups/:id/crew-sheet.pdf', () => {
  it('is one A4 page of real text: kit with power and height, camera, readings, steps, shots and the safety line', async () => {
    const r = await bytes(owner, `/api/setups/${setupId}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('application/pdf');
    expect(r.body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(r.disposition).toMatch(/^inline; filename="crew-sheet-export-check-clamshell\.pdf"$/);
    const { text, pages } = await pdfText(r.body);
    expect(pages).toBe(2); // the sheet, then the plan on its own page
    for (const expected of [
      'Export check: clamshell',
      'Key — octa above', // the light's label
      'octa (120 cm)', // its modifier
      'power 1/8', // as dialled on the head
      'height 2.10 m',
      'boom arm, sandbagged',
      'Silver under the chin', // a shaper in the kit
      'Posing stool', // a prop
      'f/8 · 1/160 · ISO 100', // camera settings
      'At the subject',
      'Key alone', // a step
      'Head and shoulders', // a shot
      DEFER_LINE,
      STANDING_CAUTIONS[0]!,
    ]) {
      expect(text, expected).toContain(expected);
    }
    // A4 is 595 × 842 pt.
    expect(r.body.toString('latin1')).toMatch(/\/MediaBox \[0 0 595\.2\d* 841\.8\d*\]/);
  });

  it('follows the account at once (not the cached session): US Letter and feet for a user who just set them; the query can override', async () => {
    const u = await fresh(base, 'Letter Person');
    expect((await u.client.request('PATCH', '/api/me', { paper: 'letter', units: 'imperial' })).status).toBe(200);
    const s = await newSetup(u.client, { title: 'Letter sheet', document: clamshell });
    const r = await bytes(u.client, `/api/setups/${s.id}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    expect(r.body.toString('latin1')).toMatch(/\/MediaBox \[0 0 612 792\]/);
    const { text } = await pdfText(r.body);
    expect(text).toMatch(/height 6′ 11″/); // 2.10 m in feet and inches
    const a4 = await bytes(u.client, `/api/setups/${s.id}/crew-sheet.pdf?paper=a4&units=metric&download=1`);
    expect(a4.body.toString('latin1')).toMatch(/\/MediaBox \[0 0 595\.2/);
    expect(a4.disposition).toMatch(/^attachment;/);
    expect((await pdfText(a4.body)).text).toContain('height 2.10 m');
  });

  it('refuses an unknown query option with a 400 naming it', async () => {
    const r = await owner.get(`/api/setups/${setupId}/crew-sheet.pdf?paper=a3`);
    expect(r.status).toBe(400);
    expect(r.body.error.fields).toHaveProperty('paper');
  });
});

describe('GET /api/setups/:id/plan.png and plan.svg', () => {
  it('draws the PNG at the width asked, with the stage’s proportions (8 × 6 m plus margins)', async () => {
    for (const width of [2000, 640]) {
      const r = await bytes(owner, `/api/setups/${setupId}/plan.png?width=${width}`);
      expect(r.status).toBe(200);
      expect(r.type).toBe('image/png');
      const meta = await sharp(r.body).metadata();
      expect(meta.format).toBe('png');
      expect(meta.width).toBe(width);
      expect(meta.height).toBe(Math.round((width * 7) / 9));
    }
    expect((await owner.get(`/api/setups/${setupId}/plan.png?width=90000`)).status).toBe(400);
  });

  it('writes a well-formed SVG with real font names and the plan’s labels', async () => {
    const r = await bytes(owner, `/api/setups/${setupId}/plan.svg`);
    expect(r.status).toBe(200);
    expect(r.type).toMatch(/^image\/svg\+xml/);
    const svg = r.body.toString('utf8');
    expect(svg.startsWith('<?xml')).toBe(true);
    // Well-formed: an XML parser reads it (sharp's SVG reader is strict about markup) and it has one root.
    const meta = await sharp(r.body).metadata();
    expect(meta.format).toBe('svg');
    expect(svg.match(/<svg /g)).toHaveLength(1);
    expect(svg).toContain('Key — octa above');
    expect(svg).toContain('font-family="IBM Plex Sans, Helvetica, Arial, sans-serif" font-weight="500"');
    expect(svg).not.toContain('IBMPlexSans_');
  });
});
