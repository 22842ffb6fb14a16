// The selected light's or camera's aim handle (ahead of it) and height handle (behind it, with its height
// written beside it), at fixed screen distances (canvas/editor/tools/handles.ts places them).
import { Circle, G, Line, Path, Text } from 'react-native-svg';
import { useShallow } from 'zustand/react/shallow';
import { formatLength, type Units } from '../../model/units';
import type { PlanTheme } from '../../drawing/theme';
import { heightOf } from '../editor/heights';
import { useEditor } from '../editor/react';
import { itemById } from '../editor/state';
import { handlesOf } from '../editor/tools/handles';

export function Handles({ theme, units }: { theme: PlanTheme; units: Units }) {
  const h = useEditor(useShallow((s) => {
    const id = s.selection.length === 1 ? s.selection[0]! : null;
    const hs = id && (!s.visibleIds || s.visibleIds.has(id)) ? handlesOf(s, id) : null;
    const item = id ? itemById(s, id) : undefined;
    // Flat numbers, so the shallow comparison sees an unchanged handle as unchanged.
    return hs && item ? { cx: hs.centre.x, cy: hs.centre.y, ax: hs.aim.x, ay: hs.aim.y, hx: hs.height.x, hy: hs.height.y, heightM: heightOf(item) ?? 0 } : { cx: NaN };
  }));
  if (!('ax' in h)) return null;
  const c = { x: h.cx, y: h.cy };
  const aim = { x: h.ax!, y: h.ay! };
  const height = { x: h.hx!, y: h.hy! };
  return (
    <G pointerEvents="none" testID="plan-handles">
      <Line x1={c.x} y1={c.y} x2={aim.x} y2={aim.y} stroke={theme.selection} strokeWidth={1.5} />
      <Circle cx={aim.x} cy={aim.y} r={9} fill={theme.selection} />
      <Line x1={c.x} y1={c.y} x2={height.x} y2={height.y} stroke={theme.selection} strokeWidth={1.5} strokeDasharray="3,3" />
      <Circle cx={height.x} cy={height.y} r={11} fill={theme.background} stroke={theme.selection} strokeWidth={2} />
      <Path d={`M${height.x},${height.y - 7} l-4,5 h8 Z M${height.x},${height.y + 7} l-4,-5 h8 Z`} fill={theme.selection} />
      <Text x={height.x} y={height.y + 26} fontSize={12} fill={theme.ink} textAnchor="middle" fontFamily="IBMPlexMono_400Regular">
        {formatLength(h.heightM!, units, 2)}
      </Text>
    </G>
  );
}
