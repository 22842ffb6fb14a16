// On the web, calc/colour.ts gets culori with only the colour spaces CSS can write (metro.config.js): hex,
// names, rgb(), hsl(), hwb(), lab(), lch(), oklab(), oklch() and color() in srgb, srgb-linear, display-p3,
// a98-rgb, prophoto-rgb, rec2020, xyz-d50 and xyz-d65. culori's index registers some twenty more spaces
// (about 70 KB of the share page); calc/colour.ts's isColour refuses culori's own `color(--space …)`
// syntax everywhere, so client and server read the same colours. tests/unit/web/culoriCss.test.ts checks
// this against the full culori.
import { useMode } from '../node_modules/culori/src/modes.js';
import modeRgb from '../node_modules/culori/src/rgb/definition.js';
import modeLrgb from '../node_modules/culori/src/lrgb/definition.js';
import modeHsl from '../node_modules/culori/src/hsl/definition.js';
import modeHwb from '../node_modules/culori/src/hwb/definition.js';
import modeLab from '../node_modules/culori/src/lab/definition.js';
import modeLch from '../node_modules/culori/src/lch/definition.js';
import modeOklab from '../node_modules/culori/src/oklab/definition.js';
import modeOklch from '../node_modules/culori/src/oklch/definition.js';
import modeXyz50 from '../node_modules/culori/src/xyz50/definition.js';
import modeXyz65 from '../node_modules/culori/src/xyz65/definition.js';
import modeP3 from '../node_modules/culori/src/p3/definition.js';
import modeA98 from '../node_modules/culori/src/a98/definition.js';
import modeProphoto from '../node_modules/culori/src/prophoto/definition.js';
import modeRec2020 from '../node_modules/culori/src/rec2020/definition.js';

export { default as converter } from '../node_modules/culori/src/converter.js';
export { default as parse } from '../node_modules/culori/src/parse.js';
export { formatHex } from '../node_modules/culori/src/formatter.js';

for (const m of [modeRgb, modeLrgb, modeHsl, modeHwb, modeLab, modeLch, modeOklab, modeOklch, modeXyz50, modeXyz65, modeP3, modeA98, modeProphoto, modeRec2020]) useMode(m);
