// The interactive layer: selection marks, rotate handles, segment end handles and the selection box.
// It reads the editor itself: the selected items as the document has them, the box, the zoom. A drag shifts
// the marks through the drag layer (dragViews.ts) and re-renders them only when the items turn or change shape.
import { memo } from 'react';
import { G, Circle, Line, Rect } from 'react-native-svg';
import { useShallow } from 'zustand/react/shallow';
import { anchorOf, isSegment, kinds, rotateHandleOf } from '../../model/kinds';
import { useEditor } from '../editor/react';
import { itemById } from '../editor/state';
import { useGroupDrag } from '../dragViews';
import type { PlanTheme } from '../../drawing/theme';

export const Overlay = memo(function Overlay({ theme }: { theme: PlanTheme }) {
  const selected = useEditor(useShallow((s) => s.selection.map((id) => itemById(s, id)).filter((i) => !!i && (!s.visibleIds || s.visibleIds.has(i.id)))));
  const { shell, moved } = useGroupDrag((o) => `translate(${o.dx} ${o.dy})`);
  const box = useEditor((s) => s.box);
  const scale = useEditor((s) => s.camera?.scale ?? 80);
  const readOnly = useEditor((s) => s.readOnly);
  const px = 1 / scale; // one screen pixel, in metres
  return (
    <G pointerEvents="none">
      <G ref={shell as never}>
      {selected
        .map((i) => moved?.get(i!.id) ?? i!)
        .map((i) => {
          const c = anchorOf(i);
          // Lights and cameras carry their own aim and height handles (Handles.tsx).
          const handle = readOnly || i.locked || i.kind === 'light' || i.kind === 'camera' ? null : rotateHandleOf(i);
          return (
            <G key={i.id}>
              {isSegment(i) ? (
                <>
                  <Line x1={i.a.x} y1={i.a.y} x2={i.b.x} y2={i.b.y} stroke={theme.selection} strokeWidth={2 * px} strokeDasharray={`${6 * px},${4 * px}`} />
                  {!readOnly && !i.locked ? (
                    <>
                      <Circle cx={i.a.x} cy={i.a.y} r={7 * px} fill={theme.background} stroke={theme.selection} strokeWidth={2 * px} />
                      <Circle cx={i.b.x} cy={i.b.y} r={7 * px} fill={theme.background} stroke={theme.selection} strokeWidth={2 * px} />
                    </>
                  ) : null}
                </>
              ) : (
                <Circle cx={c.x} cy={c.y} r={kinds[i.kind].radiusM + 6 * px} fill="none" stroke={theme.selection} strokeWidth={2 * px} strokeDasharray={i.locked ? `${3 * px},${3 * px}` : undefined} />
              )}
              {handle ? (
                <>
                  <Line x1={c.x} y1={c.y} x2={handle.x} y2={handle.y} stroke={theme.selection} strokeWidth={1.5 * px} />
                  <Circle cx={handle.x} cy={handle.y} r={8 * px} fill={theme.selection} />
                </>
              ) : null}
            </G>
          );
        })}
      </G>
      {box ? (
        <Rect
          x={Math.min(box.from.x, box.to.x)}
          y={Math.min(box.from.y, box.to.y)}
          width={Math.abs(box.to.x - box.from.x)}
          height={Math.abs(box.to.y - box.from.y)}
          fill={theme.selection}
          fillOpacity={0.08}
          stroke={theme.selection}
          strokeWidth={1.5 * px}
          strokeDasharray={`${5 * px},${3 * px}`}
        />
      ) : null}
    </G>
  );
});
