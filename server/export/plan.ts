// The plan as an image: the same sketch the editor draws (drawing/), in the paper theme, with the
// light map's one-stop contours, written as SVG and rendered to PNG by resvg with the app's fonts.
import { Resvg } from '@resvg/resvg-js';
import { sketchPlan } from '../../drawing/plan';
import { svgDocument } from '../../drawing/toSvg';
import { paperTheme } from '../../drawing/theme';
import type { SetupDocument } from '../../model/document';
import type { Readings } from '../../model/setupReadings';
import { exportReadings } from './readings';
import type { Units } from '../../model/units';
import { realFontNames, resvgFontBuffers } from './fonts';

export type PlanDrawing = { svg: string; viewBox: [number, number, number, number]; widthPx: number; heightPx: number };

/**
 * The plan sketch as an SVG document `widthPx` wide. `fontNames: 'app'` keeps the app's font names (for
 * pdfkit, which registers the files under them); 'real' writes family names and weights (files, resvg).
 */
export function planSvg(doc: SetupDocument, o: { units: Units; widthPx: number; readings?: Readings; fontNames?: 'app' | 'real'; grid?: boolean }): PlanDrawing {
  const readings = o.readings ?? exportReadings(doc);
  // sketchPlan's pxPerM only picks the scale bar's round length (about 120 px of it): ask for a bar near a
  // sixth of the drawing's width (the stage plus its 0.5 m margins), whatever the output size.
  const pxPerM = 120 / ((doc.stage.widthM + 1) / 6);
  // grid: false leaves the grid out (the crew sheet draws its own 1 m / 3 ft grid in the account's units).
  const theme = o.grid === false ? { ...paperTheme, gridMajor: 'none', gridMinor: 'none' } : paperTheme;
  const { root, viewBox } = sketchPlan(doc, { theme, units: o.units, lightMap: readings.map, pxPerM });
  const heightPx = Math.round((o.widthPx * viewBox[3]) / viewBox[2]);
  const svg = svgDocument(root, { width: o.widthPx, height: heightPx, viewBox, background: paperTheme.background });
  return { svg: o.fontNames === 'app' ? svg : realFontNames(svg), viewBox, widthPx: o.widthPx, heightPx };
}

/** The plan as a PNG `widthPx` wide (height from the stage's proportions). */
export function planPng(doc: SetupDocument, o: { units: Units; widthPx: number; readings?: Readings }): { png: Buffer; widthPx: number; heightPx: number } {
  const d = planSvg(doc, { ...o, fontNames: 'real' });
  // resvg parses the fonts it is handed on every render: the small subsets once made (prepareResvgFonts).
  const r = new Resvg(d.svg, {
    fitTo: { mode: 'width', value: o.widthPx },
    font: { fontBuffers: resvgFontBuffers(d.svg), loadSystemFonts: false, defaultFontFamily: 'IBM Plex Sans' },
    background: '#ffffff',
  } as ConstructorParameters<typeof Resvg>[1]);
  const png = r.render().asPng();
  return { png, widthPx: d.widthPx, heightPx: d.heightPx };
}
