// The light map on the plan: its contour lines (one per stop relative to the meter's reading at the subject,
// the subject's level heavier) drawn from the paths the meter's worker traced, the tone the camera records
// along each wall as a strip on the wall's camera side (canvas/meter/mapNodes.ts), and each level labelled at
// most once where its line is long and straight, clear of the lights, the items and their labels
// (drawing/contourLabels.ts, placed here at the plan's zoom). The tint under them is HeatCanvas, drawn beneath the SVG.
// The lines and wall strips change wholesale with every new map (about 30 a second while a hand drags), so on the
// web they are written straight into one group's DOM, only what changed (DirectSketch), not re-rendered element by element.
// While a hand drags on the plan the labels step aside (the lines move under the hand about 30 times a second, and
// placing their labels anew each time costs the frames the glyph needs); they come back where they fit on release.
import { memo, useMemo } from 'react';
import { G } from 'react-native-svg';
import type { LightMapResult } from '../../calc';
import { labelBounds, placeLabels } from '../../drawing/labels';
import { g } from '../../drawing/nodes';
import { contourLabelNodes } from '../../drawing/plan';
import type { Units } from '../../model/units';
import { useEditor, useEditorLate } from '../editor/react';
import { lightMapNodes } from '../meter/mapNodes';
import { DirectSketch } from '../views/DirectSketch';
import { SketchView } from '../views/SketchView';

export const LightMapLayer = memo(function LightMapLayer({ map, ink, units }: { map: LightMapResult; ink: string; units: Units }) {
  // The labels come back after the frame that shows where the hand let go (useEditorLate): placing them is
  // the largest part of the release's work here.
  const items = useEditorLate((s) => s.doc.items);
  const stage = useEditor((s) => s.doc.stage);
  const scale = useEditor((s) => s.camera?.scale ?? 80);
  const dragging = useEditorLate((s) => s.drag !== null);
  const lines = useMemo(() => lightMapNodes(map, ink, { labels: false }), [map, ink]);
  const labels = useMemo(() => {
    if (dragging) return null;
    const itemLabels = placeLabels(items, { pxPerM: scale, units, bounds: labelBounds(stage) });
    return g({}, ...contourLabelNodes(map, ink, { pxPerM: scale, items, itemLabels, units }));
  }, [map, ink, items, stage, scale, units, dragging]);
  return (
    <G pointerEvents="none">
      <DirectSketch node={lines} testID="light-map-lines" />
      {labels && <SketchView node={labels} />}
    </G>
  );
});
