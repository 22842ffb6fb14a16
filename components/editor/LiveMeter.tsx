// The editor's panels that show the live meter (canvas/meter): they follow its results at once while no
// gesture is under way and at a readable pace during one (usePaced), so a drag re-renders the dragged glyph,
// not the meter's text; the last reading shows as soon as the hand lifts.
import { memo } from 'react';
import type { MeterResult } from '../../calc';
import { PANEL_PACE_MS, useEditor, useEditorApi, usePaced, useSettled } from '../../canvas/editor/react';
import { meterSettled, type Meter } from '../../canvas/meter/meter';
import type { ItemOf, SetupDocument } from '../../model/document';
import type { Units } from '../../model/units';
import type { Readings } from '../../canvas/useReadings';
import { MeterPanel } from './MeterPanel';
import { SuggestedPower } from './SuggestedPower';

type MeterState = ReturnType<Meter['getState']>;
const pairs = new WeakMap<Readings, { readings: Readings; doc: SetupDocument }>();
const stillReading = new WeakMap<SetupDocument, { readings: null; doc: SetupDocument }>();
/** The readings with the document they were computed for (set together by the meter), as one value; readings
 *  null while the meter has not answered yet. */
function readingsAndDoc(m: MeterState): { readings: Readings | null; doc: SetupDocument } {
  if (!m.readings) {
    let q = stillReading.get(m.doc);
    if (!q) stillReading.set(m.doc, (q = { readings: null, doc: m.doc }));
    return q;
  }
  let p = pairs.get(m.readings);
  if (!p || p.doc !== m.doc) {
    p = { readings: m.readings, doc: m.doc };
    pairs.set(m.readings, p);
  }
  return p;
}

/** The light selected on the plan, as it stands when no gesture is under way (the falloff chart). */
function useSettledLight(): ItemOf<'light'> | null {
  return useSettled((s) => {
    const i = s.selection.length === 1 ? s.doc.items.find((x) => x.id === s.selection[0]) : undefined;
    return i?.kind === 'light' ? (i as ItemOf<'light'>) : null;
  });
}

/** `offscreen`: the panel is out of sight (a phone's sheet lowered to its peek), so it holds through a gesture
 *  instead of following at its pace: a render of the whole panel costs a slow phone more than a frame. */
export const LiveMeterPanel = memo(function LiveMeterPanel({ meter, units, offscreen = false }: { meter: Meter; units: Units; offscreen?: boolean }) {
  const { readings, doc } = usePaced(meter, readingsAndDoc, offscreen ? null : PANEL_PACE_MS, meterSettled);
  const selectedLight = useSettledLight();
  const editor = useEditorApi();
  const readOnly = useEditor((st) => st.readOnly);
  // Reads the document at call time, so the choice never writes back a stale meter block.
  const onReceptorChange = (receptor: MeterResult['receptor']) => editor.dispatch('updateDocument', { patch: { meter: { ...editor.getState().doc.meter, receptor } } });
  return <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} onReceptorChange={readOnly ? undefined : onReceptorChange} />;
});

export const LiveSuggestedPower = memo(function LiveSuggestedPower({ meter }: { meter: Meter }) {
  const result = usePaced(meter, (m) => m.readings?.meter ?? null, PANEL_PACE_MS, meterSettled);
  return <SuggestedPower result={result} />;
});
