const fontkit = require('fontkit');
const f = fontkit.openSync(require.resolve('@expo-google-fonts/ibm-plex-sans/500Medium/IBMPlexSans_500Medium.ttf'));
const out = [];
for (const [a, b] of [[32, 126], [160, 255]]) { const w = []; for (let c = a; c <= b; c++) w.push(f.glyphForCodePoint(c).id === 0 ? -1 : f.glyphForCodePoint(c).advanceWidth); out.push(w); }
console.log(JSON.stringify(out[0])); console.log(JSON.stringify(out[1]));
const ex = {}; for (const ch of '·°−–—′″×÷’‘“”…→←↑↓€•') { const g = f.glyphForCodePoint(ch.codePointAt(0)); ex[ch] = g.id === 0 ? -1 : g.advanceWidth; }
console.log(JSON.stringify(ex));
// kerning sample
for (const s of ['Key · 1.90 m', 'AVATAR', 'Rim left · 2.00 m · −20°']) { const run = f.layout(s); console.log(s, run.advanceWidth, [...s].reduce((t, ch) => t + f.glyphForCodePoint(ch.codePointAt(0)).advanceWidth, 0)); }
