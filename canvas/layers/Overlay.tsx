// The interactive layer: selection marks, rotate handles, segment end handles and the selection box.
import { G, Circle, Line, Rect } from 'react-native-svg';
import type { Item } from '../../model/document';
import type { Point } from '../../model/geometry';
import { anchorOf, isSegment, kinds, rotateHandleOf } from '../../model/kinds';
import type { PlanTheme } from '../views/style';

export function Overlay({ items, selection, box, theme, scale, readOnly }: { items: Item[]; selection: string[]; box: { from: Point; to: Point } | null; theme: PlanTheme; scale: number; readOnly: boolean }) {
  const px = 1 / scale; // one screen pixel, in metres
  const sel = new Set(selection);
  return (
    <G pointerEvents="none">
      {items
        .filter((i) => sel.has(i.id))
        .map((i) => {
          const c = anchorOf(i);
          const handle = readOnly || i.locked ? null : rotateHandleOf(i);
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
}
