// The plan's labels: placed clear of each other at a size fixed on screen (drawing/labels.ts), so they read on
// a phone at the fit zoom and stay the same size as the plan zooms. They are placed from the document as it
// stands: during a drag the moved items' labels step aside until the release (the placement runs once then,
// not with every move of the hand).
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import { useShallow } from 'zustand/react/shallow';
import { labelBounds, placeLabels, sketchLabels } from '../../drawing/labels';
import type { PlanTheme } from '../../drawing/theme';
import type { Units } from '../../model/units';
import { useEditor } from '../editor/react';
import { SketchView } from '../views/SketchView';

export const Labels = memo(function Labels({ theme, units }: { theme: PlanTheme; units: Units }) {
  const items = useEditor((s) => s.doc.items);
  const visible = useEditor((s) => s.visibleIds);
  const stage = useEditor((s) => s.doc.stage);
  const scale = useEditor((s) => s.camera?.scale ?? 80);
  const moving = useEditor(useShallow((s) => (s.drag ? [...s.drag.items.keys()] : [])));
  const placed = useMemo(() => placeLabels(visible ? items.filter((i) => visible.has(i.id)) : items, { pxPerM: scale, units, bounds: labelBounds(stage) }), [items, visible, stage, scale, units]);
  const node = useMemo(() => sketchLabels(moving.length ? placed.filter((p) => !moving.includes(p.id)) : placed, theme), [placed, moving, theme]);
  return (
    <G pointerEvents="none" testID="plan-labels">
      <SketchView node={node} />
    </G>
  );
});
