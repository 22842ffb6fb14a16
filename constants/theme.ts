// Falloff's design language: a graphite working surface, warm light accents, numbers in a monospace face.
export const colours = {
  graphite: '#1d2024',
  panel: '#26292e',
  panelRaised: '#30343a',
  line: '#3c4148',
  gridMinor: '#2a2e33',
  gridMajor: '#363b42',
  text: '#ece9e2',
  textDim: '#a3a49f',
  // Every text colour reads at 4.5:1 or more on graphite, panel and panelRaised (WCAG 2.2 AA; tests/unit/theme.test.ts).
  textFaint: '#9c9f98',
  accent: '#f0b24a', // warm tungsten amber: buttons, selection
  accentText: '#1d2024',
  cool: '#7cc4d8', // daylight cyan: secondary readings
  danger: '#f47c6c',
  ok: '#8fcf7a',
  paper: '#fbfaf7',
  ink: '#1b1c1e',
} as const;

export const fonts = {
  sans: 'IBMPlexSans_400Regular',
  sansMedium: 'IBMPlexSans_500Medium',
  sansBold: 'IBMPlexSans_600SemiBold',
  mono: 'IBMPlexMono_400Regular',
  monoMedium: 'IBMPlexMono_500Medium',
} as const;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radius = { sm: 6, md: 10, lg: 16 } as const;

/** Width from which the app uses a side rail and more columns. */
export const WIDE_MIN = 1024;
export const TABLET_MIN = 700;
