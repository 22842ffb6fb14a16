// The crew sheet as one printed page: header with the camera settings, the plan to a standard scale with
// its scale bar, then the kit, camera, meter readings, steps, shot list and safety notes in two columns.
// Text is real (searchable) text in the app's own fonts; the plan is the sketch drawn as vectors.
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import type { SetupDocument } from '../../model/document';
import { crewSheet, type CrewSheet, type Reading } from '../../model/crewSheet';
import { computeReadings } from '../../model/readings';
import type { Units } from '../../model/units';
import { FONT_NAMES, pdfFontBytes, type FontName } from './fonts';
import { planSvg } from './plan';

export type Paper = 'a4' | 'letter';
export type SheetInput = {
  doc: SetupDocument;
  title: string;
  units: Units;
  paper: Paper;
  /** "Harbour Light Studio · version 4 · saved 3 May 2026" */
  subtitle: string;
  /** The read-only link to print in the footer, when there is one. */
  link?: string;
};

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
export function planScale(widthM: number, depthM: number, boxW: number, boxH: number): { ratio: number; ptPerM: number } {
  const fit = Math.min(boxW / widthM, boxH / depthM); // pt per metre
  const exact = (1000 * PT_PER_MM) / fit;
  const ratio = SCALES.find((s) => s >= exact - 1e-9) ?? Math.ceil(exact);
  return { ratio, ptPerM: (1000 * PT_PER_MM) / ratio };
}

function blocksOf(doc: Doc, sheet: CrewSheet, k: number): Block[] {
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

  const out: Block[] = [];
  out.push(heading(`Lights (${sheet.lights.length})`));
  if (!sheet.lights.length) out.push(text(F.sans, size.body, dim, 'No lights on the plan.'));
  for (const l of sheet.lights) {
    out.push(
      group(
        text(F.bold, size.body, l.on ? ink : dim, `${l.name}${l.on ? '' : ' (off)'}`, { lineGap: 0.5 }),
        text(F.sans, size.body, ink, [l.source, l.modifier, l.gel ? `gel: ${l.gel}` : 'no gel'].join(' · '), { lineGap: 0.5 }),
        text(F.mono, size.small, ink, `power ${l.power} · height ${l.height} · ${l.aim} · ${l.stand}`),
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

function header(doc: Doc, input: SheetInput, sheet: CrewSheet, x: number, w: number): number {
  const y = MARGIN;
  doc.font(F.monoMedium).fontSize(7.5).fillColor(accent).text('CREW SHEET', x, y, { characterSpacing: 1.6, lineBreak: false });
  const rightW = 190;
  doc.font(F.bold).fontSize(19).fillColor(ink).text(sheet.title, x, y + 11, { width: w - rightW - 12, height: 48, ellipsis: true });
  const titleBottom = doc.y;
  doc.font(F.sans).fontSize(8.5).fillColor(dim).text(input.subtitle, x, titleBottom + 1, { width: w - rightW - 12 });
  const leftBottom = doc.y;
  // The numbers the crew set first, large and on the right.
  const cam = sheet.camera[0]!;
  const subject = sheet.readings[0]!;
  doc.font(F.sans).fontSize(7).fillColor(dim).text('CAMERA', x + w - rightW, y, { width: rightW, align: 'right', characterSpacing: 1 });
  doc.font(F.monoMedium).fontSize(12.5).fillColor(ink).text(cam.value, x + w - rightW, y + 10, { width: rightW, align: 'right' });
  doc.font(F.sans).fontSize(7).fillColor(dim).text('SUBJECT READS', x + w - rightW, doc.y + 3, { width: rightW, align: 'right', characterSpacing: 1 });
  doc.font(F.monoMedium).fontSize(12.5).fillColor(ink).text(`${subject.value}${subject.detail ? `  (${subject.detail.replace(' vs the camera', '')})` : ''}`, x + w - rightW, doc.y + 1, { width: rightW, align: 'right' });
  const bottom = Math.max(leftBottom, doc.y) + 8;
  doc.moveTo(x, bottom).lineTo(x + w, bottom).lineWidth(1.2).strokeColor(ink).stroke();
  return bottom + 10;
}

function drawPlan(doc: Doc, input: SheetInput, x: number, y: number, w: number, maxH: number): number {
  const { stage } = input.doc;
  const vbW = stage.widthM + 1;
  const vbH = stage.depthM + 1;
  const { ratio, ptPerM } = planScale(vbW, vbH, w, maxH - PLAN_CAPTION_H);
  const pw = vbW * ptPerM;
  const ph = vbH * ptPerM;
  const drawing = planSvg(input.doc, { units: input.units, widthPx: pw, fontNames: 'app' });
  const px = x + (w - pw) / 2;
  SVGtoPDF(doc, drawing.svg, px, y, {
    width: pw,
    height: ph,
    assumePt: true,
    fontCallback: (family: string) => ((FONT_NAMES as readonly string[]).includes(family) ? family : F.sans),
  });
  const cy = y + ph + 3;
  const caption = `Scale 1:${ratio} when printed at 100 % · ${input.units === 'metric' ? 'grid 0.5 m, heavy lines every 1 m' : 'grid 0.5 m (about 1′ 8″), heavy lines every 1 m'} · contours one stop apart, the heavy one at the subject’s level`;
  doc.font(F.sans).fontSize(7).fillColor(dim).text(caption, x, cy, { width: w, align: 'center', lineBreak: false });
  return cy + PLAN_CAPTION_H;
}

function footer(doc: Doc, input: SheetInput, x: number, w: number, pageH: number, page: number) {
  const y = pageH - MARGIN + 6;
  doc.moveTo(x, y - 4).lineTo(x + w, y - 4).lineWidth(0.5).strokeColor(rule).stroke();
  const left = `Falloff crew sheet · ${input.title}${input.link ? ` · ${input.link}` : ''}`;
  doc.font(F.sans).fontSize(6.5).fillColor(dim).text(left, x, y, { width: w - 60, lineBreak: false, ellipsis: true });
  doc.text(`page ${page}`, x + w - 60, y, { width: 60, align: 'right', lineBreak: false });
}

/** The crew sheet PDF. Fits one page, shrinking the type a little for a big setup; a huge one runs on. */
export async function crewSheetPdf(input: SheetInput): Promise<Buffer> {
  const [pageW, pageH] = PAPER[input.paper];
  const doc = new PDFDocument({
    size: [pageW, pageH],
    // A small bottom margin so the footer below the columns never makes pdfkit start a page of its own.
    margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: 12 },
    autoFirstPage: true,
    info: { Title: `Crew sheet: ${input.title}`, Author: 'Falloff', Subject: 'Lighting setup crew sheet', Creator: 'Falloff' },
  });
  for (const name of FONT_NAMES) doc.registerFont(name, pdfFontBytes(name));
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const readings = computeReadings(input.doc);
  const sheet = crewSheet(input.doc, { title: input.title, units: input.units, readings });
  const x = MARGIN;
  const w = pageW - 2 * MARGIN;
  const colW = (w - GUTTER) / 2;
  const bottom = pageH - MARGIN - 8;

  const top = header(doc, input, sheet, x, w);
  // The plan takes what the text leaves: try full-size type with the largest plan first, then a smaller
  // plan, then slightly smaller type, until everything fits on the page.
  const avail = bottom - top;
  const planUse = (maxH: number) => (input.doc.stage.depthM + 1) * planScale(input.doc.stage.widthM + 1, input.doc.stage.depthM + 1, w, maxH - PLAN_CAPTION_H).ptPerM + PLAN_CAPTION_H + 3;
  let chosen: { placed: NonNullable<ReturnType<typeof flow>>; planH: number } | null = null;
  search: for (const k of [1, 0.93, 0.86, 0.8, 0.74]) {
    const blocks = blocksOf(doc, sheet, k);
    for (const share of [0.56, 0.5, 0.45, 0.4, 0.35, 0.3, 0.25]) {
      const planH = avail * share;
      const placed = flow(blocks, colW, avail - planUse(planH) - 8, 2);
      if (placed) {
        chosen = { placed, planH };
        break search;
      }
    }
  }
  // Too much for one page: a plan still big enough to rig from, and the text runs on to a second page.
  const planH = chosen?.planH ?? avail * 0.45;
  const colTop = drawPlan(doc, input, x, top, w, planH) + 8;
  let page = 1;
  if (chosen) {
    for (const p of chosen.placed) p.b.draw(x + p.col * (colW + GUTTER), colTop + p.y, colW);
  } else {
    // Too much for one page: two columns under the plan, then further pages.
    const blocks = blocksOf(doc, sheet, 0.86);
    let col = 0;
    let y = colTop;
    for (let i = 0; i < blocks.length; i++) {
      const b = blocks[i]!;
      const h = b.height(colW);
      const need = b.keepWithNext && blocks[i + 1] ? h + blocks[i + 1]!.height(colW) : h;
      if (y + need > bottom && y > MARGIN) {
        col++;
        y = page === 1 ? colTop : MARGIN;
        if (col > 1) {
          footer(doc, input, x, w, pageH, page);
          doc.addPage({ size: [pageW, pageH], margins: { top: MARGIN, left: MARGIN, right: MARGIN, bottom: 12 } });
          page++;
          col = 0;
          y = MARGIN;
        }
      }
      b.draw(x + col * (colW + GUTTER), y, colW);
      y += h;
    }
  }
  footer(doc, input, x, w, pageH, page);
  doc.end();
  return done;
}
