// The crew sheet, to rig from: a first page with the numbers to set first and a QR code of the live plan,
// then in two columns the notes, each light (distances to the subject and background, height, aim, power,
// the meter's expected reading), stands and set, camera, meter, a rigging checklist with tick boxes, steps,
// shots and safety notes; then the plan on a page of its own (landscape when the set is wider than deep) at
// the largest standard scale that fills it, with a scale bar and a 1 m / 3 ft grid. A shoot day's sheets
// (daySheetPdf) are several of these behind a cover. Text is real (searchable) text in the app's own fonts;
// the plan is the sketch drawn as vectors; the QR code is drawn as vector squares.
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import SVGtoPDF from 'svg-to-pdfkit';
import type { SetupDocument } from '../../model/document';
import { DEFER_LINE, crewSheet, type CrewSheet, type Reading } from '../../model/crewSheet';
import type { Readings } from '../../model/setupReadings';
import { exportReadings } from './readings';
import type { Units } from '../../model/units';
import { FONT_NAMES, pdfFonts, type FontName } from './fonts';
import { FRAME_LIMITS } from '../../calc/frame/render';
import { planSvg } from './plan';

type Paper = 'a4' | 'letter';
export type SheetInput = {
  doc: SetupDocument;
  title: string;
  units: Units;
  paper: Paper;
  /** "Harbour Light Studio · version 4 · saved 3 May 2026" */
  subtitle: string;
  /** The read-only link to print in the footer, when there is one. */
  link?: string;
  /** The setup's notes. */
  notes?: string;
  /** The address the QR code opens: the share link, else the setup in the app (members sign in). */
  qr?: { url: string; caption: string };
  /**
   * THE FRAME ("the look we are after"): a PNG of what the camera will record, when the frame is available.
   * The crew sheet prints it under its own heading at the top of the columns (frameBlock below).
   */
  frame?: Buffer;
};
export type DaySheetInput = { title: string; date?: string; paper: Paper; sheets: SheetInput[] };

const PAPER = { a4: [595.28, 841.89], letter: [612, 792] } as const;
const MARGIN = 34;
const GUTTER = 18;
const PLAN_CAPTION_H = 12;
const PT_PER_MM = 72 / 25.4;
/** Architectural scales a plan is printed at (1:n). */
const SCALES = [10, 20, 25, 50, 75, 100, 125, 150, 200, 250, 300, 400, 500, 750, 1000, 2000];

const ink = '#1b1c1e';
const dim = '#62646a';
const rule = '#d6d4ce';
const accent = '#9a5d00';
const alert = '#a3241b';

const F = {
  sans: 'IBMPlexSans_400Regular',
  medium: 'IBMPlexSans_500Medium',
  bold: 'IBMPlexSans_600SemiBold',
  mono: 'IBMPlexMono_400Regular',
  monoMedium: 'IBMPlexMono_500Medium',
} as const satisfies Record<string, FontName>;

type Doc = InstanceType<typeof PDFDocument>;
/** A piece of a column: its height at width `w`, and how to draw it at (x, y). */
type Block = { height: (w: number) => number; draw: (x: number, y: number, w: number) => void; keepWithNext?: boolean };

/** The largest standard scale at which `sizeM` fits in `sizePt`, and points per plan metre at it. */
function planScale(widthM: number, depthM: number, boxW: number, boxH: number): { ratio: number; ptPerM: number } {
  const fit = Math.min(boxW / widthM, boxH / depthM); // pt per metre
  const exact = (1000 * PT_PER_MM) / fit;
  const ratio = SCALES.find((s) => s >= exact - 1e-9) ?? Math.ceil(exact);
  return { ratio, ptPerM: (1000 * PT_PER_MM) / ratio };
}

function blocksOf(doc: Doc, input: SheetInput, sheet: CrewSheet, k: number): Block[] {
  const size = { head: 10.5 * k, body: 8.2 * k, small: 7.2 * k };
  const text = (font: FontName, pt: number, colour: string, s: string, o: PDFKit.Mixins.TextOptions = {}): Block => ({
    height: (w) => doc.font(font).fontSize(pt).heightOfString(s, { width: w, lineGap: 1, ...o }),
    draw: (x, y, w) => void doc.font(font).fontSize(pt).fillColor(colour).text(s, x, y, { width: w, lineGap: 1, ...o }),
  });
  const gap = (h: number): Block => ({ height: () => h * k, draw: () => {} });
  const heading = (s: string): Block => ({
    keepWithNext: true,
    height: () => size.head * 1.25 + 7 * k,
    draw: (x, y, w) => {
      doc.moveTo(x, y + 2).lineTo(x + w, y + 2).lineWidth(0.6).strokeColor(rule).stroke();
      doc.font(F.bold).fontSize(size.head).fillColor(ink).text(s, x, y + 5 * k, { width: w, lineBreak: false });
    },
  });
  /** Label left, value right (mono), detail below in small dim type. */
  const reading = (r: Reading): Block => {
    const valueW = (w: number) => Math.min(w * 0.45, doc.font(F.monoMedium).fontSize(size.body).widthOfString(r.value) + 2);
    return {
      height: (w) => {
        const top = Math.max(doc.font(F.medium).fontSize(size.body).heightOfString(r.label, { width: w - valueW(w) - 6 }), doc.font(F.monoMedium).fontSize(size.body).heightOfString(r.value, { width: valueW(w) }));
        return top + (r.detail ? doc.font(F.sans).fontSize(size.small).heightOfString(r.detail, { width: w }) : 0) + 2.5 * k;
      },
      draw: (x, y, w) => {
        const vw = valueW(w);
        doc.font(F.medium).fontSize(size.body).fillColor(ink).text(r.label, x, y, { width: w - vw - 6 });
        const h1 = doc.y - y;
        doc.font(F.monoMedium).fontSize(size.body).fillColor(ink).text(r.value, x + w - vw, y, { width: vw, align: 'right' });
        const top = Math.max(h1, doc.y - y);
        if (r.detail) doc.font(F.sans).fontSize(size.small).fillColor(dim).text(r.detail, x, y + top, { width: w });
      },
    };
  };

  /** Several blocks kept together in one column. */
  const group = (...parts: Block[]): Block => ({
    height: (w) => parts.reduce((h, p) => h + p.height(w), 0),
    draw: (x, y, w) => {
      let at = y;
      for (const p of parts) {
        p.draw(x, at, w);
        at += p.height(w);
      }
    },
  });
  /** A caution with a small drawn triangle (the fonts have no ▲), text indented beside it. */
  const caution = (s: string, colour = ink): Block => {
    const indent = 9 * k;
    const t = text(F.sans, size.body, colour, s, { lineGap: 0.5 });
    return {
      height: (w) => t.height(w - indent) + 2 * k,
      draw: (x, y, w) => {
        const c = size.body * 0.62;
        const ty = y + size.body * 0.28;
        doc.polygon([x, ty + c], [x + c / 2, ty], [x + c, ty + c]).fillColor(accent).fill();
        t.draw(x + indent, y, w - indent);
      },
    };
  };

  /** A row with an empty tick box, for the rigging checklist. */
  const tick = (t: string): Block => {
    const indent = 12 * k;
    const body = text(F.sans, size.body, ink, t, { lineGap: 0.5 });
    return {
      height: (w) => body.height(w - indent) + 3 * k,
      draw: (x, y, w) => {
        const b = size.body * 0.8;
        doc.rect(x + 0.5, y + 1.2, b, b).lineWidth(0.7).strokeColor(ink).stroke();
        body.draw(x + indent, y, w - indent);
      },
    };
  };

  const out: Block[] = [];
  // THE FRAME: "the look we are after" goes first, when the frame is available (SheetInput.frame).
  const frame = frameBlock(doc, input, k);
  if (frame) out.push(group(heading('The look we are after'), frame, text(F.sans, size.small, dim, `What the camera should record, rendered from this plan. ${FRAME_LIMITS}`, { lineGap: 0.5 })));
  if (sheet.notes) out.push(group(heading('Notes'), text(F.sans, size.body, ink, sheet.notes, { lineGap: 1 })));
  out.push(heading(`Lights (${sheet.lights.length})`));
  if (!sheet.lights.length) out.push(text(F.sans, size.body, dim, 'No lights on the plan.'));
  for (const l of sheet.lights) {
    const where = [l.toSubject ? `${l.toSubject} to the subject` : null, l.toBackground ? `${l.toBackground} to the background` : null].filter(Boolean).join(' · ');
    out.push(
      group(
        text(F.bold, size.body, l.on ? ink : dim, `${l.name}${l.on ? '' : ' (off)'}`, { lineGap: 0.5 }),
        text(F.sans, size.body, ink, [l.source, l.modifier, l.gel ? `gel: ${l.gel}` : 'no gel'].join(' · '), { lineGap: 0.5 }),
        text(F.mono, size.small, ink, `power ${l.power}${l.expected ? ` · reads ${l.expected} at the subject` : ''} · height ${l.height}`),
        text(F.mono, size.small, ink, `aim ${l.aim}${where ? ` · ${where}` : ''} · ${l.stand}`),
        gap(4),
      ),
    );
  }
  if (sheet.gear.length) {
    out.push(heading('Stands, shapers and set'));
    for (const g of sheet.gear) out.push(group(text(F.sans, size.body, ink, `${g.what}: ${g.detail}`, { lineGap: 0.5 }), gap(1.5)));
  }
  // The camera's few lines stay together with their heading.
  out.push(group(heading('Camera'), ...sheet.camera.map(reading)));
  out.push(heading('Meter at the subject'));
  sheet.readings.forEach((r) => out.push(reading(r)));
  for (const w of sheet.warnings) out.push(caution(w, alert));
  if (sheet.checklist.length) {
    out.push(heading('Rigging, in order'));
    let step: string | null = null;
    for (const c of sheet.checklist) {
      if (c.step && c.step !== step) out.push(group(gap(1), text(F.medium, size.small, dim, `Step ${c.step}`)));
      step = c.step;
      out.push(tick(c.text));
    }
  }
  if (sheet.steps.length) {
    out.push(heading('Steps'));
    for (const s of sheet.steps) {
      out.push(
        group(
          text(F.bold, size.body, ink, `${s.n}. ${s.title}`, { lineGap: 0.5 }),
          ...(s.note ? [text(F.sans, size.body, ink, s.note, { lineGap: 0.5 })] : []),
          ...(s.adds.length ? [text(F.sans, size.small, dim, `Adds: ${s.adds.join(', ')}`)] : []),
          gap(3),
        ),
      );
    }
  }
  if (sheet.shots.length) {
    out.push(heading('Shot list'));
    for (const s of sheet.shots) out.push(reading({ label: `${s.framing} · ${s.lens}`, value: s.settings, detail: s.note || undefined }));
  }
  out.push(heading('Safety'));
  for (const c of sheet.safety) out.push(caution(c));
  return out;
}

/** Place blocks into columns of height `colH`; returns the placements or null when they do not fit. */
function flow(blocks: Block[], colW: number, colH: number, columns: number) {
  const placed: { b: Block; col: number; y: number }[] = [];
  let col = 0;
  let y = 0;
  for (let i = 0; i < blocks.length; i++) {
    const b = blocks[i]!;
    const h = b.height(colW);
    // A heading moves to the next column with the block after it.
    const need = b.keepWithNext && blocks[i + 1] ? h + blocks[i + 1]!.height(colW) : h;
    if (y + need > colH && y > 0) {
      col++;
      y = 0;
    }
    if (col >= columns) return null;
    placed.push({ b, col, y });
    y += h;
  }
  return placed;
}

/**
 * THE FRAME — the marked place for "the look we are after": the frame's picture at the column's width, when
 * SheetInput.frame carries one (a PNG). Without it the sheet prints no empty box.
 */
function frameBlock(doc: Doc, input: SheetInput, k: number): Block | null {
  if (!input.frame) return null;
  // pdfkit opens an image once (its types omit openImage); the opened image is drawn like a buffer.
  const img = (doc as unknown as { openImage(b: Buffer): { width: number; height: number } }).openImage(input.frame);
  const aspect = img.height / img.width;
  return {
    height: (w) => w * aspect + 6 * k,
    draw: (x, y, w) => void doc.image(img as unknown as Buffer, x, y + 2 * k, { width: w }),
  };
}

const QR_SIZE = 62;

/** A QR code of `url` as vector squares, `size` points wide, quiet zone included. */
function drawQr(doc: Doc, url: string, x: number, y: number, size: number) {
  const q = QRCode.create(url, { errorCorrectionLevel: 'M' });
  const n = q.modules.size;
  const cell = size / (n + 2); // one module of quiet zone each side
  doc.rect(x, y, size, size).fillColor('#ffffff').fill();
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) if (q.modules.get(r, c)) doc.rect(x + (c + 1) * cell, y + (r + 1) * cell, cell + 0.02, cell + 0.02);
  doc.fillColor('#000000').fill();
}

function header(doc: Doc, input: SheetInput, sheet: CrewSheet, x: number, w: number): number {
  const y = MARGIN;
  const qrW = input.qr ? QR_SIZE + 10 : 0;
  doc.font(F.monoMedium).fontSize(7.5).fillColor(accent).text('CREW SHEET', x, y, { characterSpacing: 1.6, lineBreak: false });
  const rightW = 180;
  const leftW = w - rightW - qrW - 12;
  doc.font(F.bold).fontSize(19).fillColor(ink).text(sheet.title, x, y + 11, { width: leftW, height: 48, ellipsis: true });
  const titleBottom = doc.y;
  doc.font(F.sans).fontSize(8.5).fillColor(dim).text(input.subtitle, x, titleBottom + 1, { width: leftW });
  const leftBottom = doc.y;
  // The numbers the crew set first, large and on the right.
  const cam = sheet.camera[0]!;
  const subject = sheet.readings[0]!;
  const rx = x + w - qrW - rightW;
  doc.font(F.sans).fontSize(7).fillColor(dim).text('CAMERA', rx, y, { width: rightW, align: 'right', characterSpacing: 1 });
  doc.font(F.monoMedium).fontSize(12.5).fillColor(ink).text(cam.value, rx, y + 10, { width: rightW, align: 'right' });
  doc.font(F.sans).fontSize(7).fillColor(dim).text('SUBJECT READS', rx, doc.y + 3, { width: rightW, align: 'right', characterSpacing: 1 });
  // The reading large, as the meter shows it; what it is measured against in small type under it (the detail
  // set large ran over three lines of the header).
  doc.font(F.monoMedium).fontSize(12.5).fillColor(ink).text(subject.value, rx, doc.y + 1, { width: rightW, align: 'right' });
  if (subject.detail) doc.font(F.sans).fontSize(7).fillColor(dim).text(subject.detail, rx, doc.y + 1, { width: rightW, align: 'right' });
  let rightBottom = doc.y;
  if (input.qr) {
    const qx = x + w - QR_SIZE;
    drawQr(doc, input.qr.url, qx, y - 4, QR_SIZE);
    doc.font(F.sans).fontSize(6).fillColor(dim).text(input.qr.caption, qx - 6, y - 4 + QR_SIZE + 1, { width: QR_SIZE + 6, align: 'right' });
    rightBottom = Math.max(rightBottom, doc.y);
  }
  const bottom = Math.max(leftBottom, rightBottom) + 8;
  doc.moveTo(x, bottom).lineTo(x + w, bottom).lineWidth(1.2).strokeColor(ink).stroke();
  return bottom + 10;
}

function footer(doc: Doc, input: SheetInput, x: number, w: number, pageH: number, page: number) {
  const y = pageH - MARGIN + 6;
  doc.moveTo(x, y - 4).lineTo(x + w, y - 4).lineWidth(0.5).strokeColor(rule).stroke();
  const left = `Falloff crew sheet · ${input.title}${input.link ? ` · ${input.link}` : ''}`;
  doc.font(F.sans).fontSize(6.5).fillColor(dim).text(left, x, y, { width: w - 60, lineBreak: false, ellipsis: true });
  doc.text(`page ${page}`, x + w - 60, y, { width: 60, align: 'right', lineBreak: false });
}

const pageMargins = { top: MARGIN, left: MARGIN, right: MARGIN, bottom: 12 };

/**
 * The plan on a page of its own, portrait or landscape, whichever prints it at the larger standard scale,
 * with the 1 m (metric) or 3 ft (imperial) grid drawn over the stage and the sketch's scale bar.
 */
function planPage(doc: Doc, input: SheetInput, sheet: CrewSheet, paper: readonly [number, number], pages: { n: number }, readings: Readings) {
  const { stage } = input.doc;
  const vbW = stage.widthM + 1;
  const vbH = stage.depthM + 1;
  const titleH = 30;
  const fits = ([pw, ph]: readonly [number, number]) => planScale(vbW, vbH, pw - 2 * MARGIN, ph - 2 * MARGIN - titleH - PLAN_CAPTION_H - 14);
  const portrait = fits(paper);
  const landscapeSize = [paper[1], paper[0]] as const;
  const landscape = fits(landscapeSize);
  const [pageW, pageH] = landscape.ptPerM > portrait.ptPerM * 1.001 ? landscapeSize : paper;
  const { ratio, ptPerM } = landscape.ptPerM > portrait.ptPerM * 1.001 ? landscape : portrait;
  doc.addPage({ size: [pageW, pageH], margins: pageMargins });
  pages.n++;
  const x = MARGIN;
  const w = pageW - 2 * MARGIN;
  doc.font(F.monoMedium).fontSize(7.5).fillColor(accent).text('PLAN', x, MARGIN, { characterSpacing: 1.6, lineBreak: false });
  doc.font(F.bold).fontSize(13).fillColor(ink).text(sheet.title, x + 40, MARGIN - 3, { width: w - 40, lineBreak: false, ellipsis: true });
  const top = MARGIN + titleH;
  const pw = vbW * ptPerM;
  const ph = vbH * ptPerM;
  const px = x + (w - pw) / 2;
  const drawing = planSvg(input.doc, { units: input.units, widthPx: pw, fontNames: 'app', grid: false, readings });
  SVGtoPDF(doc, drawing.svg, px, top, {
    width: pw,
    height: ph,
    assumePt: true,
    fontCallback: (family: string) => ((FONT_NAMES as readonly string[]).includes(family) ? family : F.sans),
  });
  // The grid in the account's units, over the stage (plan origin at 0.5 m in from the drawing's corner).
  const ox = px + 0.5 * ptPerM;
  const oy = top + 0.5 * ptPerM;
  const major = input.units === 'metric' ? 1 : 0.9144; // 1 m, or 3 ft
  const minor = input.units === 'metric' ? 0.5 : 0.3048; // 0.5 m, or 1 ft
  const lines = (step: number, colour: string, width: number) => {
    doc.save();
    for (let m = 0; m <= stage.widthM + 1e-6; m += step) doc.moveTo(ox + m * ptPerM, oy).lineTo(ox + m * ptPerM, oy + stage.depthM * ptPerM);
    for (let m = 0; m <= stage.depthM + 1e-6; m += step) doc.moveTo(ox, oy + m * ptPerM).lineTo(ox + stage.widthM * ptPerM, oy + m * ptPerM);
    doc.lineWidth(width).strokeColor(colour).strokeOpacity(0.55).stroke();
    doc.restore();
  };
  lines(minor, '#c9c6bd', 0.25);
  lines(major, '#8f8c84', 0.5);
  const cy = top + ph + 4;
  const grid = input.units === 'metric' ? 'grid 1 m, fine lines every 0.5 m' : 'grid 3 ft, fine lines every 1 ft';
  const caption = `Scale 1:${ratio} when printed at 100 % · ${grid} · ${sheet.stage} · contours one stop apart, the heavy one at the subject’s level`;
  doc.font(F.sans).fontSize(7.5).fillColor(dim).text(caption, x, cy, { width: w, align: 'center', lineBreak: false });
  footer(doc, input, x, w, pageH, pages.n);
}

/** One setup's sheet into `doc`: its text pages, then its plan page. `first`: the document's first page is blank and ours. */
function renderSheet(doc: Doc, input: SheetInput, pages: { n: number }, first: boolean) {
  const paper = PAPER[input.paper];
  const [pageW, pageH] = paper;
  if (!first) doc.addPage({ size: [pageW, pageH], margins: pageMargins });
  pages.n++;
  const readings = exportReadings(input.doc);
  const sheet = crewSheet(input.doc, { title: input.title, units: input.units, readings, notes: input.notes });
  const x = MARGIN;
  const w = pageW - 2 * MARGIN;
  const colW = (w - GUTTER) / 2;
  const bottom = pageH - MARGIN - 8;
  const top = header(doc, input, sheet, x, w);
  // Two columns, full-size type if it fits on the page, else a little smaller, else running on to more pages.
  let blocks: Block[] = [];
  for (const k of [1, 0.93, 0.86]) {
    blocks = blocksOf(doc, input, sheet, k);
    if (flow(blocks, colW, bottom - top, 2)) break;
  }
  let col = 0;
  let y = top;
  let colTop = top;
  for (let i = 0; i < blocks.length; i++) {
    const b = blocks[i]!;
    const h = b.height(colW);
    const need = b.keepWithNext && blocks[i + 1] ? h + blocks[i + 1]!.height(colW) : h;
    if (y + need > bottom && y > colTop) {
      col++;
      y = colTop;
      if (col > 1) {
        footer(doc, input, x, w, pageH, pages.n);
        doc.addPage({ size: [pageW, pageH], margins: pageMargins });
        pages.n++;
        col = 0;
        colTop = MARGIN;
        y = MARGIN;
      }
    }
    b.draw(x + col * (colW + GUTTER), y, colW);
    y += h;
  }
  footer(doc, input, x, w, pageH, pages.n);
  planPage(doc, input, sheet, paper, pages, readings);
  return sheet;
}

/** Word layouts (fontkit's shaping of each word, the larger part of a sheet's text time) kept per parsed font
 *  for the process, not per document: pdfkit keeps one cache per document's font, so every PDF shaped the same
 *  words again. A layout depends only on the font and the word (pdfkit asks it for no features here) and is
 *  only read once made; each document still subsets its own glyphs when it writes the text. Bounded. */
const LAYOUTS_PER_FONT = 20_000;
const sharedLayouts = new WeakMap<object, { runs: Record<string, unknown>; n: number }>();
type EmbeddedFontLike = { font?: object; layoutCache?: Record<string, unknown>; layoutCached?: (text: string) => unknown };
function shareLayouts(doc: PDFKit.PDFDocument) {
  const font = doc.font.bind(doc);
  doc.font = ((...args: Parameters<typeof font>) => {
    const out = font(...args);
    const f = (doc as unknown as { _font?: EmbeddedFontLike })._font;
    if (f?.font && f.layoutCache && f.layoutCached && !Object.prototype.hasOwnProperty.call(f, 'layoutCached')) {
      let shared = sharedLayouts.get(f.font);
      if (!shared) sharedLayouts.set(f.font, (shared = { runs: Object.create(null) as Record<string, unknown>, n: 0 }));
      const own = f.layoutCached.bind(f);
      const box = shared;
      f.layoutCached = (text: string) => {
        const hit = box.runs[text];
        if (hit) return hit;
        const run = own(text);
        if (box.n >= LAYOUTS_PER_FONT) {
          box.runs = Object.create(null) as Record<string, unknown>;
          box.n = 0;
        }
        box.runs[text] = run;
        box.n++;
        return run;
      };
    }
    return out;
  }) as typeof doc.font;
}

function newDoc(paper: Paper, info: { Title: string; Subject: string }) {
  const [pageW, pageH] = PAPER[paper];
  const doc = new PDFDocument({
    size: [pageW, pageH],
    // A small bottom margin so the footer below the columns never makes pdfkit start a page of its own.
    margins: pageMargins,
    autoFirstPage: true,
    // Kept in memory so a day sheet's cover can be drawn last (it lists the page each sheet starts on).
    bufferPages: true,
    info: { ...info, Author: 'Falloff', Creator: 'Falloff' },
  });
  // Parsed once per process (fonts.ts): registering bytes would parse every font again for each PDF.
  for (const [name, font] of pdfFonts()) doc.registerFont(name, font as Parameters<typeof doc.registerFont>[1]);
  shareLayouts(doc);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return { doc, done };
}

/** The crew sheet PDF: the sheet's page (more for a big setup), then the plan's page. */
export async function crewSheetPdf(input: SheetInput): Promise<Buffer> {
  const { doc, done } = newDoc(input.paper, { Title: `Crew sheet: ${input.title}`, Subject: 'Lighting setup crew sheet' });
  renderSheet(doc, input, { n: 0 }, true);
  doc.end();
  return done;
}

/** A shoot day: a cover listing the setups in the order given (with the page each starts on), then each sheet. */
export async function daySheetPdf(input: DaySheetInput): Promise<Buffer> {
  const { doc, done } = newDoc(input.paper, { Title: `Day sheets: ${input.title}`, Subject: 'Crew sheets for a shoot day' });
  const pages = { n: 1 }; // the cover
  const starts: { input: SheetInput; sheet: CrewSheet; page: number }[] = [];
  // Sheets first (the cover needs their page numbers), into a buffer of pages; the cover is drawn last on page 1.
  for (const s of input.sheets) {
    const page = pages.n + 1;
    starts.push({ input: s, sheet: renderSheet(doc, s, pages, false), page });
  }
  doc.switchToPage(0);
  const [pageW, pageH] = PAPER[input.paper];
  const x = MARGIN;
  const w = pageW - 2 * MARGIN;
  doc.font(F.monoMedium).fontSize(7.5).fillColor(accent).text('SHOOT DAY · CREW SHEETS', x, MARGIN, { characterSpacing: 1.6, lineBreak: false });
  doc.font(F.bold).fontSize(22).fillColor(ink).text(input.title, x, MARGIN + 12, { width: w });
  if (input.date) doc.font(F.sans).fontSize(11).fillColor(dim).text(input.date, x, doc.y + 2, { width: w });
  let y = doc.y + 14;
  doc.moveTo(x, y).lineTo(x + w, y).lineWidth(1.2).strokeColor(ink).stroke();
  y += 10;
  doc.font(F.sans).fontSize(8.5).fillColor(dim).text(`${starts.length} setup${starts.length === 1 ? '' : 's'}, in shooting order. Each sheet is followed by its plan.`, x, y, { width: w });
  y = doc.y + 10;
  starts.forEach((s, k) => {
    const lights = s.sheet.lights.filter((l) => l.on).length;
    doc.font(F.bold).fontSize(12).fillColor(ink).text(`${k + 1}. ${s.input.title}`, x, y, { width: w - 70 });
    doc.font(F.mono).fontSize(10).fillColor(ink).text(`page ${s.page}`, x + w - 70, y + 1, { width: 70, align: 'right' });
    doc.font(F.sans).fontSize(8.5).fillColor(dim).text(`${s.input.subtitle} · ${lights} light${lights === 1 ? '' : 's'} on · camera ${s.sheet.camera[0]!.value} · subject reads ${s.sheet.readings[0]!.value}`, x + 14, doc.y + 1, { width: w - 14 });
    y = doc.y + 10;
    doc.moveTo(x, y - 5).lineTo(x + w, y - 5).lineWidth(0.5).strokeColor(rule).stroke();
  });
  doc.font(F.sans).fontSize(8).fillColor(dim).text(DEFER_LINE, x, Math.max(y + 8, pageH - MARGIN - 40), { width: w });
  doc.end();
  return done;
}
