// The selected light's or camera's aim handle (ahead of it) and height handle (behind it, with its height
// written beside it), at fixed screen distances (canvas/editor/tools/handles.ts places them).
import { Circle, G, Line, Path, Text } from 'react-native-svg';
import { useShallow } from 'zustand/react/shallow';
import { formatLength, type Units } from '../../model/units';
import type { PlanTheme } from '../../drawing/theme';
import { heightOf } from '../editor/heights';
import type { Item } from '../../model/document';
import { useEditor, useEditorApi } from '../editor/react';
import { itemById, type EditorState } from '../editor/state';
import { useGroupDrag } from '../dragViews';
import { handlesOf } from '../editor/tools/handles';

export function Handles({ theme, units }: { theme: PlanTheme; units: Units }) {
  const editor = useEditorApi();
  // A drag shifts the handles through the drag layer (screen pixels); a turn or a lift re-renders them.
  const { shell, moved } = useGroupDrag((o) => {
    const k = editor.getState().camera?.scale ?? 1;
    return `translate(${o.dx * k} ${o.dy * k})`;
  });
  const settled = useEditor(useShallow((s) => flat(s, undefined)));
  const id = settled.id;
  const live = id ? moved?.get(id) : undefined;
  const h = live ? flat(editor.getState(), live) : settled;
  if (!('ax' in h)) return null;
  const c = { x: h.cx, y: h.cy };
  const aim = { x: h.ax!, y: h.ay! };
  const height = { x: h.hx!, y: h.hy! };
  return (
    <G pointerEvents="none" testID="plan-handles" ref={shell as never}>
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

/** The selected item's handles as flat numbers (a shallow comparison then sees unchanged handles as
 *  unchanged), drawn for `live` when a gesture holds it, else as the document has it. */
function flat(s: EditorState, live: Item | undefined) {
  const id = s.selection.length === 1 ? s.selection[0]! : null;
  const item = live ?? (id ? itemById(s, id) : undefined);
  const hs = id && (!s.visibleIds || s.visibleIds.has(id)) ? handlesOf(s, id, item) : null;
  return hs && item ? { id, cx: hs.centre.x, cy: hs.centre.y, ax: hs.aim.x, ay: hs.aim.y, hx: hs.height.x, hy: hs.height.y, heightM: heightOf(item) ?? 0 } : { id, cx: NaN };
}
