// Native has no canvas element to paint the light map into; the contour lines still show.
import type { LightMapResult } from '../../calc';

export function heatImageUri(_map: LightMapResult): string | null {
  return null;
}
