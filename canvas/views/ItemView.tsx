// One plan item on screen, memoised by the item's identity: a drag re-renders only the item that moves.
import { memo, useMemo } from 'react';
import type { Item } from '../../model/document';
import type { Units } from '../../model/units';
import { sketchItem } from '../sketch/glyphs';
import { SketchView } from './SketchView';
import type { PlanTheme } from './style';

export const ItemView = memo(function ItemView({ item, theme, units }: { item: Item; theme: PlanTheme; units: Units }) {
  const node = useMemo(() => sketchItem(item, { theme, units }), [item, theme, units]);
  return <SketchView node={node} />;
});
