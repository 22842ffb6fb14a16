// Safety cautions for a plan, shown beside the meter where they apply and on every crew sheet.
// The wording defers to local codes and licensed practice: Falloff cannot see the venue's wiring.
import type { SetupDocument } from './document';

export type Caution = { code: string; message: string; itemId?: string };

/** A common domestic circuit, for the warning threshold only: 16 A at 230 V or 15 A at 120 V is ~1800–3700 W.
 *  We warn from the lower figure, with 80 % continuous-load headroom (common practice). */
export const CIRCUIT_WARN_W = 1800 * 0.8;

/** Always on a crew sheet. */
export const STANDING_CAUTIONS: string[] = [
  'Sandbag every stand and boom; keep a hand on a boom while it is being moved.',
  'Tape down cables; keep walkways clear, especially when the room is dark.',
  'Modelling lamps and continuous lights get hot: keep gels and diffusion at the distance their maker states.',
  'Never open a flash head or pack: it holds a stored charge after it is switched off.',
  'Add up continuous-light watts against the circuit’s rating before plugging in.',
  'Tell the subject before the flashes fire.',
  'Follow local electrical and venue codes and licensed practice; these notes do not replace them.',
];

export function planCautions(doc: SetupDocument): Caution[] {
  const out: Caution[] = [];
  let continuousW = 0;
  for (const it of doc.items) {
    if (it.kind !== 'light') continue;
    const name = it.label || it.id;
    if (it.source.type === 'continuous') {
      continuousW += it.source.watts;
      if (it.source.lamp === 'tungsten' && it.gel !== 'none') {
        out.push({ code: 'hot-gel', itemId: it.id, message: `${name}: a tungsten lamp runs hot — keep the gel at its maker’s distance, on a frame, not on the lamp.` });
      }
    }
    if (it.stand === 'boom' && !it.sandbagged) {
      out.push({ code: 'boom-no-sandbag', itemId: it.id, message: `${name} is on a boom with no sandbag noted: counterweight and sandbag the stand before anyone stands under it.` });
    }
  }
  if (continuousW > CIRCUIT_WARN_W) {
    out.push({
      code: 'circuit-load',
      message: `Continuous lights draw about ${Math.round(continuousW)} W together — more than one ordinary circuit comfortably carries. Split them across circuits as the venue’s electrician advises.`,
    });
  }
  return out;
}
