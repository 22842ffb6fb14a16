// The working grid: 0.5 m minor and 1 m major lines over the stage.
import { memo } from 'react';
import { G, Line, Rect } from 'react-native-svg';
import type { PlanTheme } from '../views/style';

export const Grid = memo(function Grid({ widthM, depthM, theme }: { widthM: number; depthM: number; theme: PlanTheme }) {
  const lines = [];
  for (let x = 0; x <= widthM + 1e-9; x += 0.5) {
    const major = Math.abs(x - Math.round(x)) < 1e-9;
    lines.push(<Line key={`x${x}`} x1={x} y1={0} x2={x} y2={depthM} stroke={major ? theme.gridMajor : theme.gridMinor} strokeWidth={major ? 0.012 : 0.008} />);
  }
  for (let y = 0; y <= depthM + 1e-9; y += 0.5) {
    const major = Math.abs(y - Math.round(y)) < 1e-9;
    lines.push(<Line key={`y${y}`} x1={0} y1={y} x2={widthM} y2={y} stroke={major ? theme.gridMajor : theme.gridMinor} strokeWidth={major ? 0.012 : 0.008} />);
  }
  return (
    <G pointerEvents="none">
      <Rect x={0} y={0} width={widthM} height={depthM} fill={theme.background} stroke={theme.gridMajor} strokeWidth={0.02} />
      {lines}
    </G>
  );
});
