// The working grid: 0.5 m minor and 1 m major lines over the stage (its ground is drawn beneath, see PlanCanvas).
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import type { SetupDocument } from '../../model/document';
import { sketchGrid } from '../../drawing/plan';
import { SketchView } from '../views/SketchView';
import type { PlanTheme } from '../../drawing/theme';

export const Grid = memo(function Grid({ stage, theme }: { stage: SetupDocument['stage']; theme: PlanTheme }) {
  const node = useMemo(() => sketchGrid(stage, theme, 'none'), [stage, theme]);
  return (
    <G pointerEvents="none">
      <SketchView node={node} />
    </G>
  );
});
