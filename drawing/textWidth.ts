// How wide a label is, from the advance widths of the app's own faces (they ship with the app, so the table
// holds wherever the plan is drawn: the editor, the share page and the exports). Plan labels are IBM Plex Sans
// Medium; numbers and tapes are IBM Plex Mono, 0.6 em for every character. Widths are the font file's advances
// in thousandths of an em (tests/unit/drawing/textWidth.test.ts reads them back from the file, and the e2e
// suite compares whole labels with the browser's own measureText). Kerning is left out: it moves a label by
// a few hundredths of an em at most.

/** U+0020 … U+007E. */
const ASCII = [
  236, 299, 451, 678, 599, 947, 706, 253, 336, 336, 514, 600, 288, 401, 288, 416, 600, 600, 600, 600, 600, 600, 600, 600, 600, 600, 308, 308, 600, 600, 600, 487, 896, 660, 659, 634, 682, 593, 570,
  705, 714, 414, 531, 660, 513, 815, 714, 711, 627, 711, 655, 599, 577, 685, 627, 926, 639, 617, 592, 324, 416, 324, 600, 561, 600, 549, 592, 509, 592, 555, 340, 538, 580, 265, 265, 548, 285, 882,
  580, 562, 592, 592, 383, 494, 365, 580, 512, 799, 530, 514, 487, 355, 352, 355, 600,
];
/** U+00A0 … U+00FF (accented Latin letters and signs). */
const LATIN1 = [
  236, 299, 530, 589, 619, 624, 352, 579, 600, 783, 420, 532, 600, 0, 471, 600, 469, 600, 346, 346, 600, 585, 663, 340, 600, 353, 413, 532, 843, 866, 826, 479, 660, 660, 660, 660, 660, 660, 933, 634,
  593, 593, 593, 593, 414, 414, 414, 414, 686, 714, 711, 711, 711, 711, 711, 600, 711, 685, 685, 685, 685, 617, 627, 662, 549, 549, 549, 549, 549, 549, 864, 509, 555, 555, 555, 555, 265, 265, 265, 265,
  575, 580, 562, 562, 562, 562, 562, 600, 570, 580, 580, 580, 580, 514, 592, 514,
];
/** Marks the app's own words use (units, ranges, quotes, arrows). */
const MARKS: Record<string, number> = {
  '·': 340, '°': 469, '−': 600, '–': 588, '—': 780, '′': 253, '″': 451, '×': 600, '÷': 600, '’': 285, '‘': 285, '“': 501, '”': 500, '…': 843, '→': 854, '←': 854, '↑': 854, '↓': 854, '€': 626, '•': 411,
};
/** Anything else: a wide character (CJK, emoji) takes about an em, other letters about 0.6 em (common practice). */
const OTHER = 600;
const WIDE = 1000;

/** The sans face's advance of one character, thousandths of an em. */
export function sansAdvance(ch: string): number {
  const c = ch.codePointAt(0) ?? 32;
  if (c >= 0x20 && c <= 0x7e) return ASCII[c - 0x20]!;
  if (c >= 0xa0 && c <= 0xff) return LATIN1[c - 0xa0]!;
  const mark = MARKS[ch];
  if (mark !== undefined) return mark;
  return c >= 0x2e80 ? WIDE : OTHER;
}

/** A line of text's width in ems, in the label face (`mono`: the numbers' face). */
export function textWidthEm(words: string, mono: boolean): number {
  let sum = 0;
  for (const ch of words) sum += mono ? ((ch.codePointAt(0) ?? 0) >= 0x2e80 ? WIDE : 600) : sansAdvance(ch);
  return sum / 1000;
}
