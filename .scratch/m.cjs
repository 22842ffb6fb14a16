const fontkit = require('fontkit');
const m = fontkit.openSync(require.resolve('@expo-google-fonts/ibm-plex-mono/400Regular/IBMPlexMono_400Regular.ttf'));
for (const ch of '0123456789 .,:/−+°′″fmsISOftin·') { try { const g = m.glyphForCodePoint(ch.codePointAt(0)); console.log(ch, g.id, m.hmtx ? m.hmtx.metrics.get(g.id)?.advance : '', (()=>{try{return g.advanceWidth}catch(e){return 'ERR'}})()); } catch (e) { console.log(ch, 'ERR') } }
