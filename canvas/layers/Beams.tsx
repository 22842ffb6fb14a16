// A light's cone: a translucent fan as wide as its modifier's beam, tinted by its gel (memoised by the light).
import { memo, useMemo } from 'react';
import type { ItemOf } from '../../model/document';
import { sketchBeam, type BeamClip } from '../../drawing/plan';
import { SketchView } from '../views/SketchView';

// Cut short at the walls and the stage's edge (`clip`), as on paper.
export const Beam = memo(function Beam({ light, clip }: { light: ItemOf<'light'>; clip?: BeamClip }) {
  const node = useMemo(() => sketchBeam(light, clip), [light, clip]);
  return node ? <SketchView node={node} /> : null;
});
