// Light cones: a translucent fan per light, as wide as its modifier's beam, tinted by its gel.
import { memo } from 'react';
import { G, Path } from 'react-native-svg';
import { GELS, MODIFIERS } from '../../calc';
import type { ItemOf } from '../../model/document';

const REACH_M = 3;

const Beam = memo(function Beam({ light }: { light: ItemOf<'light'> }) {
  if (!light.on) return null;
  const spec = MODIFIERS[light.modifier];
  const halfDeg = Math.min(80, light.gridDeg !== null ? Math.min(spec.halfAngleDeg, light.gridDeg / 2) : spec.halfAngleDeg);
  const h = (halfDeg * Math.PI) / 180;
  const ex = Math.cos(h) * REACH_M;
  const ey = Math.sin(h) * REACH_M;
  const tint = GELS[light.gel].tint;
  return (
    <G x={light.x} y={light.y} rotation={light.aimDeg}>
      <Path d={`M0,0 L${ex},${-ey} A${REACH_M},${REACH_M} 0 0 1 ${ex},${ey} Z`} fill={tint} opacity={0.1} />
    </G>
  );
});

export function Beams({ lights }: { lights: ItemOf<'light'>[] }) {
  return (
    <G pointerEvents="none">
      {lights.map((l) => (
        <Beam key={l.id} light={l} />
      ))}
    </G>
  );
}
