// The working grid over the stage (its ground is drawn beneath, see PlanCanvas): lines at the step a drag snaps to
// at this zoom (gridStepM: 0.5 m on a phone at fit, 0.25 m wide, finer zoomed in; in feet and inches for someone
// who works in them), heavier on whole metres or whole feet, so the lines an item lands on are the lines drawn.
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import type { SetupDocument } from '../../model/document';
import { sketchGrid } from '../../drawing/plan';
import { SketchView } from '../views/SketchView';
import type { PlanTheme } from '../../drawing/theme';

export const Grid = memo(function Grid({ stage, theme, stepM, majorM = 1 }: { stage: SetupDocument['stage']; theme: PlanTheme; stepM: number; majorM?: number }) {
  const node = useMemo(() => sketchGrid(stage, theme, 'none', stepM, majorM), [stage, theme, stepM, majorM]);
  return (
    <G pointerEvents="none">
      <SketchView node={node} />
    </G>
  );
});
