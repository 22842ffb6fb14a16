// The light map under the plan: the falloff as a tinted image (web) and one-stop contour lines, labelled.
import { memo, useMemo } from 'react';
import { G, Image } from 'react-native-svg';
import type { LightMapResult } from '../../calc';
import { sketchContours } from '../sketch/plan';
import { SketchView } from '../views/SketchView';
import { heatImageUri } from './heatImage';

export const LightMapLayer = memo(function LightMapLayer({ map, ink }: { map: LightMapResult; ink: string }) {
  const uri = useMemo(() => heatImageUri(map), [map]);
  const contours = useMemo(() => sketchContours(map, ink), [map, ink]);
  return (
    <G pointerEvents="none">
      {uri ? (
        // Each value is a grid point; the image's pixels are centred on them.
        <Image href={uri} x={map.x0 - map.dxM / 2} y={map.y0 - map.dyM / 2} width={map.x1 - map.x0 + map.dxM} height={map.y1 - map.y0 + map.dyM} preserveAspectRatio="none" opacity={0.9} />
      ) : null}
      <SketchView node={contours} />
    </G>
  );
});
