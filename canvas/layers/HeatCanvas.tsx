// Native draws the light map as contour lines only (no canvas element to paint the tint into).
import type { LightMapResult } from '../../calc';
import type { Viewport } from '../viewport';

export function HeatCanvas(_props: { map: LightMapResult; view: Viewport }) {
  return null;
}
