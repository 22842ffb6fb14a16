// GET …/frame.png over real HTTP: members and share-link holders get the frame (the same pure code as the
// editor's view, on the server's worker thread); outsiders do not; a bad width is a 400 naming it.
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { demoSetups } from '../../db/seed-setups';
import { type Client, freshEmail } from '../support/http';
import { SHEET_FRAME_WIDTH } from '../../server/export/frame';
import { inbox, pdfText, raw } from './exports.helpers';
import { fresh, newSetup } from './fixtures';

const base = inject('baseUrl');
const teal = demoSetups.find((s) => s.title.startsWith('Teal'))!.document;

let owner: Client;
let setupId: string;

beforeAll(async () => {
  owner = (await fresh(base, 'Frame Owner')).client;
  setupId = (await newSetup(owner, { title: 'Frame check: teal', document: teal })).id;
});

describe('the crew sheet carries the frame', () => {
  it('prints "the look we are after": the frame as an image on the sheet, with its caption and what it leaves out', async () => {
    const r = await raw(base, owner, `/api/setups/${setupId}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    const { text } = await pdfText(r.body);
    expect(text).toMatch(/The look we are after/i);
    expect(text).toContain('What the camera should record, rendered from this plan.');
    expect(text).toMatch(/lens flare/);
    // The picture itself: an image XObject SHEET_FRAME_WIDTH px wide (the frame; the plan is vectors, the QR code squares).
    const pdf = r.body.toString('latin1');
    expect(pdf).toMatch(new RegExp(`/Subtype\\s*/Image[\\s\\S]{0,200}?/Width\\s+${SHEET_FRAME_WIDTH}\\b`));
  });

  it('the crew sheet e-mailed to the crew carries the same frame as the downloaded one (read back from the local mail fake)', async () => {
    const to = freshEmail('framecrew');
    const sent = await owner.post(`/api/setups/${setupId}/send`, { to: [to] });
    expect(sent.status, JSON.stringify(sent.body)).toBe(201);
    const [mail] = await inbox(base, to);
    expect(mail!.attachments).toHaveLength(1);
    const mailed = await raw(base, null, `/dev/inbox/${mail!.id}/attachments/0`);
    expect(mailed.body.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await pdfText(mailed.body)).text).toMatch(/The look we are after/i);
    const downloaded = await raw(base, owner, `/api/setups/${setupId}/crew-sheet.pdf`);
    const a = frameImage(mailed.body);
    const b = frameImage(downloaded.body);
    expect(a, 'the mailed PDF has the frame image').not.toBeNull();
    // The same pixels: the image streams are byte for byte the same (same render, same PNG, same embedding).
    expect(a!.equals(b!)).toBe(true);
  });

  it('a plan with no subject prints its sheet without the frame (no empty box)', async () => {
    const bare = await newSetup(owner, { title: 'Frame check: bare', document: { schemaVersion: 1, stage: { widthM: 6, depthM: 5 }, items: [] } as never });
    const r = await raw(base, owner, `/api/setups/${bare.id}/crew-sheet.pdf`);
    expect(r.status).toBe(200);
    const { text } = await pdfText(r.body);
    expect(text).not.toMatch(/The look we are after/i);
    expect(r.body.toString('latin1')).not.toMatch(/\/Subtype\s*\/Image/);
  });
});

describe('GET /api/setups/:id/frame.png', () => {
  it('is a PNG of the asked width with the sensor\'s 3:2 proportions, in colour and in black and white', async () => {
    const r = await raw(base, owner, `/api/setups/${setupId}/frame.png?width=300`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('image/png');
    expect(r.disposition).toMatch(/^inline; filename="frame-frame-check-teal\.png"$/);
    const { data, info } = await sharp(r.body).raw().toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([300, 200]);
    // The teal wash: somewhere the blue-green channels clearly beat red.
    let teal = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i + 1]! > data[i]! + 40 && data[i + 2]! > data[i]! + 40) teal++;
    expect(teal).toBeGreaterThan(500);
    const m = await raw(base, owner, `/api/setups/${setupId}/frame.png?width=300&look=mono`);
    const mono = await sharp(m.body).raw().toBuffer({ resolveWithObject: true });
    for (let i = 0; i < mono.data.length; i += mono.info.channels * 97) expect(mono.data[i + 1]).toBe(mono.data[i]);
  });

  it('renders the plan at a step (the lesson player\'s frame per step): before the teal light the wash is absent', async () => {
    const r = await raw(base, owner, `/api/setups/${setupId}/frame.png?width=200&step=1`);
    expect(r.status).toBe(200);
    const { data, info } = await sharp(r.body).raw().toBuffer({ resolveWithObject: true });
    let teal = 0;
    for (let i = 0; i < data.length; i += info.channels) if (data[i + 1]! > data[i]! + 40 && data[i + 2]! > data[i]! + 40) teal++;
    expect(teal).toBe(0);
  });

  it('rejects a bad width or step with a 400 naming the field', async () => {
    for (const q of ['width=5', 'width=99999', 'width=abc']) {
      const r = await owner.get(`/api/setups/${setupId}/frame.png?${q}`);
      expect(r.status, q).toBe(400);
      expect(Object.keys(r.body.error.fields ?? {}), q).toContain('width');
    }
    const s = await owner.get(`/api/setups/${setupId}/frame.png?step=9`);
    expect(s.status).toBe(400);
    expect(Object.keys(s.body.error.fields)).toContain('step');
  });

  it('is for readers of the setup only: an outsider gets no picture', async () => {
    const outsider = (await fresh(base, 'Frame Outsider')).client;
    const r = await raw(base, outsider, `/api/setups/${setupId}/frame.png`);
    expect([403, 404]).toContain(r.status);
    expect(r.type).not.toBe('image/png');
  });

  it('opens through a share link without an account', async () => {
    const { token } = (await owner.post(`/api/setups/${setupId}/shares`, {})).body;
    const r = await raw(base, null, `/api/shared/${token}/frame.png?width=160`);
    expect(r.status).toBe(200);
    expect(r.type).toBe('image/png');
    const bad = await raw(base, null, `/api/shared/${token}/frame.png?width=1`);
    expect(bad.status).toBe(400);
  });
});

/** The frame's image XObject stream in a PDF (the image SHEET_FRAME_WIDTH px wide), or null. */
function frameImage(pdf: Buffer): Buffer | null {
  const text = pdf.toString('latin1');
  const re = new RegExp(`/Subtype\\s*/Image[\\s\\S]{0,200}?/Width\\s+${SHEET_FRAME_WIDTH}\\b[\\s\\S]*?>>\\s*stream\\r?\\n`, 'g');
  const m = re.exec(text);
  if (!m) return null;
  const start = m.index + m[0].length;
  const end = text.indexOf('endstream', start);
  return pdf.subarray(start, end);
}
