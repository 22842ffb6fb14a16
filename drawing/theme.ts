// Plan glyph styling, in plan metres (the canvas scales metres to pixels). Two themes: graphite for work,
// paper for print.
export type PlanTheme = {
  background: string;
  gridMinor: string;
  gridMajor: string;
  ink: string;
  inkDim: string;
  label: string;
  selection: string;
  subject: string;
  camera: string;
  light: string;
  flag: string;
};

export const graphiteTheme: PlanTheme = {
  background: '#1d2024',
  gridMinor: '#262a2f',
  gridMajor: '#333840',
  ink: '#e6e3dc',
  inkDim: '#8d8f8a',
  label: '#c9c7c0',
  selection: '#f0b24a',
  subject: '#e9d7c4',
  camera: '#9fb4c7',
  light: '#f6e7b8',
  flag: '#0b0b0c',
};

export const paperTheme: PlanTheme = {
  background: '#ffffff',
  gridMinor: '#eeeeec',
  gridMajor: '#dcdcd8',
  ink: '#1b1c1e',
  inkDim: '#6b6d70',
  label: '#2a2b2d',
  selection: '#c7780a',
  subject: '#7a5c44',
  camera: '#3c5a75',
  light: '#8a6a10',
  flag: '#111111',
};

/** Stroke widths, metres. */
export const STROKE = 0.025;
export const THIN = 0.012;
