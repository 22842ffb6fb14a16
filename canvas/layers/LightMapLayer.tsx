// The light map under the plan: the falloff as a tinted image and one-stop contour lines, each labelled.
import { memo, useMemo } from 'react';
import { G, Image, Polyline, Text as SvgText } from 'react-native-svg';
import type { LightMapResult } from '../../calc';
import { formatStops } from '../../model/units';
import { heatImageUri } from './heatImage';

export const LightMapLayer = memo(function LightMapLayer({ map, ink }: { map: LightMapResult; ink: string }) {
  const uri = useMemo(() => heatImageUri(map), [map]);
  const w = map.x1 - map.x0;
  const h = map.y1 - map.y0;
  return (
    <G pointerEvents="none">
      {uri ? (
        // Each value is a grid point; the image's pixels are centred on them.
        <Image href={uri} x={map.x0 - map.dxM / 2} y={map.y0 - map.dyM / 2} width={w + map.dxM} height={h + map.dyM} preserveAspectRatio="none" opacity={0.9} />
      ) : null}
      {map.contours.map((level) =>
        level.lines.map((line, k) => {
          const mid = line[Math.floor(line.length / 2)];
          return (
            <G key={`${level.stops}-${k}`}>
              <Polyline points={line.map(([x, y]) => `${x},${y}`).join(' ')} fill="none" stroke={ink} strokeWidth={level.stops === 0 ? 0.018 : 0.01} opacity={level.stops === 0 ? 0.8 : 0.45} />
              {mid && line.length > 12 && k === 0 ? (
                <SvgText x={mid[0]} y={mid[1]} fontSize={0.13} fill={ink} opacity={0.8} fontFamily="IBMPlexMono_400Regular" textAnchor="middle">
                  {formatStops(level.stops)}
                </SvgText>
              ) : null}
            </G>
          );
        }),
      )}
    </G>
  );
});
