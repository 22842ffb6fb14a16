// One plan item on screen, memoised by the item's identity: a drag re-renders only the item that moves.
// A point item's glyph is drawn once at the origin and placed with a translate, so a move that changes only
// where it stands rewrites one transform, not every element of the glyph.
import { memo, useMemo, useRef } from 'react';
import { G } from 'react-native-svg';
import type { Item } from '../../model/document';
import { isSegment } from '../../model/kinds';
import type { Units } from '../../model/units';
import { sketchItem } from '../../drawing/glyphs';
import { shapeAtOrigin, type Shape } from './placed';
import { SketchView } from './SketchView';
import type { PlanTheme } from '../../drawing/theme';

export const ItemView = memo(function ItemView({ item, theme, units }: { item: Item; theme: PlanTheme; units: Units }) {
  const shape = useRef<Shape | null>(null);
  const whole = useMemo(() => (isSegment(item) ? sketchItem(item, { theme, units }) : null), [item, theme, units]);
  if (whole) return <SketchView node={whole} />;
  shape.current = shapeAtOrigin(shape.current, item, theme, units);
  if (!shape.current.placed) return <SketchView node={shape.current.node} />;
  const { x, y } = item as { x: number; y: number };
  return (
    <G transform={`translate(${x} ${y})`}>
      <SketchView node={shape.current.node} />
    </G>
  );
});
