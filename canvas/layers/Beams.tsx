// Light cones: a translucent fan per light, as wide as its modifier's beam, tinted by its gel.
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import type { ItemOf } from '../../model/document';
import { sketchBeam } from '../sketch/plan';
import { SketchView } from '../views/SketchView';

const Beam = memo(function Beam({ light }: { light: ItemOf<'light'> }) {
  const node = useMemo(() => sketchBeam(light), [light]);
  return node ? <SketchView node={node} /> : null;
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
