// The light map's contour lines on the plan: one per stop relative to the subject, labelled. The tint under
// them is HeatCanvas, drawn beneath the SVG.
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import type { LightMapResult } from '../../calc';
import { sketchContours } from '../sketch/plan';
import { SketchView } from '../views/SketchView';

export const LightMapLayer = memo(function LightMapLayer({ map, ink }: { map: LightMapResult; ink: string }) {
  const contours = useMemo(() => sketchContours(map, ink), [map, ink]);
  return (
    <G pointerEvents="none">
      <SketchView node={contours} />
    </G>
  );
});
