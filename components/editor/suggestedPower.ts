// The meter's suggested power for one light, ready to apply with one tap: for a rim, hair or kicker the power
// that brings it to its level over the key; for a key, fill or unassigned light the power for the target
// aperture. Rounded to a tenth of a stop (what the power field shows) and kept within the light's range; null
// when there is nothing to change, nothing known, or the light cannot reach it.
import type { LightReading, MeterResult } from '../../calc';

export type PowerSuggestion = { lightId: string; fraction: number; why: 'level-over-key' | 'target-aperture' };

const tenthStop = (f: number) => 2 ** (Math.round(Math.log2(f) * 10) / 10);

export function suggestedPower(m: MeterResult | null | undefined, lightId: string): PowerSuggestion | null {
  const l: LightReading | undefined = m?.lights.find((x) => x.id === lightId);
  if (!l || !l.enabled) return null;
  let fraction: number | null = null;
  let why: PowerSuggestion['why'] = 'target-aperture';
  if (l.vsKey) {
    if (l.vsKey.fraction !== null && !l.vsKey.beyondFull && !l.vsKey.belowMinimum) fraction = l.vsKey.fraction;
    why = 'level-over-key';
  } else if (!l.backgroundTone && (l.role === 'auto' || l.role === 'key' || l.role === 'fill') && l.forTarget.fraction !== null && !l.forTarget.beyondFull && !l.forTarget.belowMinimum) {
    fraction = l.forTarget.fraction;
  }
  if (fraction === null || !Number.isFinite(fraction)) return null;
  const f = Math.min(1, Math.max(Math.max(1 / 1024, l.minPowerFraction), tenthStop(fraction)));
  // Already there, to a tenth of a stop.
  if (Math.abs(Math.log2(f) - Math.log2(l.powerFraction)) < 0.05) return null;
  return { lightId, fraction: f, why };
}
