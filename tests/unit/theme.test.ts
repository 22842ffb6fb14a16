// Text in the app's theme meets WCAG 2.2 AA contrast (4.5:1 for body text) on every surface it sits on.
import { describe, expect, it } from 'vitest';
import { colours } from '../../constants/theme';

// Relative luminance and contrast ratio as WCAG 2.2 defines them (success criterion 1.4.3, "relative luminance").
const lum = (hex: string) => {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
};
const contrast = (a: string, b: string) => {
  const [x, y] = [lum(a), lum(b)];
  return (Math.max(x, y) + 0.05) / (Math.min(x, y) + 0.05);
};

describe('theme contrast', () => {
  const surfaces = { graphite: colours.graphite, panel: colours.panel, panelRaised: colours.panelRaised };
  const texts = { text: colours.text, textDim: colours.textDim, textFaint: colours.textFaint, accent: colours.accent, cool: colours.cool, danger: colours.danger, ok: colours.ok };
  for (const [tn, t] of Object.entries(texts))
    for (const [sn, s] of Object.entries(surfaces)) it(`${tn} on ${sn} is at least 4.5:1`, () => expect(contrast(t, s)).toBeGreaterThanOrEqual(4.5));
  it('text on the accent (buttons, chosen options) is at least 4.5:1', () => expect(contrast(colours.accentText, colours.accent)).toBeGreaterThanOrEqual(4.5));
  it('the formula matches WCAG for black on white (21:1)', () => expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 6));
});
