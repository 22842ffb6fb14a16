// A setup's plan shown read-only, as it stands at one step (items appear as the steps go on), with its light
// map; the Meter's readings for the same step come with it. Optionally with numbered comment pins and a tap
// to pin a new one. It is the editor's own canvas on a read-only editor: the same camera (zoom and pan work
// with pins shown; pins follow), the same hit testing, the same taps.
import { useEffect, useMemo } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useStore } from 'zustand';
import { PlanCanvas, SecondaryPlan, usePlanCamera, ItemTestIds } from '../../canvas/PlanCanvas';
import { toScreen } from '../../canvas/editor/camera';
import { createEditor, type Editor } from '../../canvas/editor/editor';
import { EditorContext, useEditor } from '../../canvas/editor/react';
import { itemById } from '../../canvas/editor/state';
import { graphiteTheme } from '../../canvas/views';
import { colours, fonts } from '../../constants/theme';
import type { ItemOf, SetupDocument } from '../../model/document';
import type { Point } from '../../model/geometry';
import { anchorOf } from '../../model/kinds';
import { computeReadings, type Readings } from '../../model/setupReadings';
import { itemsAtStep } from '../../model/documentToScene';
import type { Units } from '../../model/units';
import { ErrorBoundary } from '../ErrorBoundary';

export type Pin = { n: number; itemId: string | null; point: Point | null };
export type PinTarget = { itemId: string; label: string } | { point: Point };

/** A read-only editor and the readings for a document at a step: one editor per document, readings per step. */
export function usePlanAtStep(doc: SetupDocument, stepIndex: number | undefined) {
  const store = useMemo(() => createEditor(doc, { readOnly: true }), [doc]);
  useEffect(() => {
    store.dispatch('setVisible', { ids: stepIndex === undefined ? null : new Set(itemsAtStep(doc, stepIndex).map((i) => i.id)) });
  }, [store, doc, stepIndex]);
  const readings: Readings = useMemo(() => computeReadings(doc, { stepIndex, lightMap: true }), [doc, stepIndex]);
  return { store, readings };
}

/** The light selected on the plan (for the Meter's falloff chart), read from the plan's editor. */
export function useSelectedLight(store: Editor): ItemOf<'light'> | null {
  return useStore(store, (s) => {
    const i = s.selection.length === 1 ? itemById(s, s.selection[0]!) : undefined;
    return i?.kind === 'light' ? (i as ItemOf<'light'>) : null;
  });
}

export function ReadOnlyPlan({
  store,
  readings,
  units,
  pins,
  onPin,
  testID,
  secondary = false,
}: {
  store: Editor;
  /** The meter's readings for the plan (their light map is drawn); null: a plan without the light map. */
  readings: Pick<Readings, 'map'> | null;
  units: Units;
  pins?: Pin[];
  /** When given, a tap on the plan pins to the item under it, else to the point. */
  onPin?: (t: PinTarget) => void;
  testID?: string;
  /** A second plan on a screen that already shows one: hidden from assistive tech (nothing in it takes focus),
   *  its markers' test ids are `pin-item-<id>`. */
  secondary?: boolean;
}) {
  const onTap = onPin
    ? (p: Point, hit: { id: string; label?: string; kind: string } | null) =>
        hit ? onPin({ itemId: hit.id, label: hit.label || hit.kind }) : onPin({ point: { x: Math.round(p.x * 100) / 100, y: Math.round(p.y * 100) / 100 } })
    : undefined;
  return (
    <View style={styles.host} testID={testID} aria-hidden={secondary || undefined}>
      <EditorContext.Provider value={store}>
        <ErrorBoundary what="the plan" compact>
          <ItemTestIds.Provider value={secondary ? 'pin-item-' : 'item-'}>
            <SecondaryPlan.Provider value={secondary}>
              <PlanCanvas theme={graphiteTheme} units={units} lightMap={readings?.map ?? null} onTap={onTap}>
                {pins || onPin ? <Pins pins={pins ?? []} tapToPin={!!onPin} testID={testID ? `${testID}-pins` : undefined} /> : null}
              </PlanCanvas>
            </SecondaryPlan.Provider>
          </ItemTestIds.Provider>
        </ErrorBoundary>
      </EditorContext.Provider>
    </View>
  );
}

/** Numbered pins over the plan, placed with the plan's own camera (they follow zoom and pan). */
function Pins({ pins, tapToPin, testID }: { pins: Pin[]; tapToPin: boolean; testID?: string }) {
  const camera = usePlanCamera();
  const items = useEditor((s) => s.doc);
  if (!camera) return null;
  return (
    <View style={StyleSheet.absoluteFill} pointerEvents="box-none" testID={testID} accessibilityLabel={tapToPin ? 'Tap the plan to pin a comment to the item or spot under your finger' : 'Plan with comment pins'}>
      {pins.map((p) => {
        const item = p.itemId ? items.items.find((i) => i.id === p.itemId) : null;
        const at = item ? anchorOf(item) : p.point;
        if (!at) return null;
        const sp = toScreen(camera, at);
        return (
          <View key={p.n} pointerEvents="none" style={[styles.pin, { left: sp.x - 12, top: sp.y - 30 }]} accessibilityLabel={`Comment ${p.n}`}>
            <Text style={styles.pinText}>{p.n}</Text>
          </View>
        );
      })}
      {tapToPin ? (
        <View style={styles.legend} pointerEvents="none">
          <Text style={styles.legendText}>Tap to pin</Text>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  host: { flex: 1, minHeight: 200, overflow: 'hidden', borderRadius: 10, borderWidth: 1, borderColor: colours.line },
  pin: { position: 'absolute', width: 24, height: 24, borderRadius: 12, borderBottomLeftRadius: 2, backgroundColor: colours.accent, alignItems: 'center', justifyContent: 'center', borderWidth: 2, borderColor: colours.graphite },
  pinText: { color: colours.accentText, fontFamily: fonts.monoMedium, fontSize: 12 },
  legend: { position: 'absolute', left: 6, top: 6, borderRadius: 8, backgroundColor: colours.panel, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center', paddingHorizontal: 8, paddingVertical: 4 },
  legendText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 11, textAlign: 'center' },
});
