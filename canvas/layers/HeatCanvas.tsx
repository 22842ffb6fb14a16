// Native draws the light map as contour lines only (no canvas element to paint the tint into).
import type { LightMapResult } from '../../calc';
import type { Camera } from '../editor/camera';

export function HeatCanvas(_props: { map: LightMapResult; view: Camera }) {
  return null;
}
