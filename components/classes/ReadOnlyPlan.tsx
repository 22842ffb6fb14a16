// A setup's plan shown read-only, as it stands at one step (items appear as the steps go on), with its light
// map; the Meter's readings for the same step come with it. Optionally with numbered comment pins and a tap
// to pin a new one.
//
// Pins need to know where plan metres fall on screen. PlanCanvas keeps its viewport to itself, so while pins
// are shown the plan stays at its fitted view (a layer over it takes the taps, and the canvas is remounted
// when its box changes size), which is the view `fitStage` gives for the same box.
import { useMemo, useRef, useState } from 'react';
import { Platform, Pressable, StyleSheet, Text, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { PlanCanvas } from '../../canvas/PlanCanvas';
import { useStore } from 'zustand';
import { EditorContext, createEditorStore, type EditorStore } from '../../canvas/state/store';
import { graphiteTheme } from '../../canvas/views';
import { fitStage, toPlan, toScreen } from '../../canvas/viewport';
import { colours, fonts } from '../../constants/theme';
import type { ItemOf, SetupDocument } from '../../model/document';
import type { Point } from '../../model/geometry';
import { anchorOf, hitTest } from '../../model/kinds';
import { computeReadings, type Readings } from '../../model/readings';
import { itemsAtStep } from '../../model/scene';
import type { Units } from '../../model/units';

export type Pin = { n: number; itemId: string | null; point: Point | null };
export type PinTarget = { itemId: string; label: string } | { point: Point };

/** The store and readings for a document at a step: one store per document, readings per step. */
export function usePlanAtStep(doc: SetupDocument, stepIndex: number | undefined) {
  const store = useMemo(() => createEditorStore(doc, { readOnly: true }), [doc]);
  const visible = useMemo(() => (stepIndex === undefined ? null : new Set(itemsAtStep(doc, stepIndex).map((i) => i.id))), [doc, stepIndex]);
  const readings: Readings = useMemo(() => computeReadings(doc, { stepIndex, lightMap: true }), [doc, stepIndex]);
  return { store, visible, readings };
}

/** The light selected on the plan (for the Meter's falloff chart), read from the plan's store. */
export function useSelectedLight(store: EditorStore): ItemOf<'light'> | null {
  return useStore(store, (s) => {
    const i = s.selection.length === 1 ? s.doc.items.find((x) => x.id === s.selection[0]) : undefined;
    return i?.kind === 'light' ? (i as ItemOf<'light'>) : null;
  });
}

export function ReadOnlyPlan({
  store,
  visible,
  readings,
  units,
  pins,
  onPin,
  testID,
}: {
  store: EditorStore;
  visible: Set<string> | null;
  readings: Readings;
  units: Units;
  pins?: Pin[];
  /** When given, a tap on the plan pins to the item under it, else to the point. */
  onPin?: (t: PinTarget) => void;
  testID?: string;
}) {
  const [size, setSize] = useState<{ w: number; h: number } | null>(null);
  const onLayout = (e: LayoutChangeEvent) => {
    const { width, height } = e.nativeEvent.layout;
    setSize((s) => (s && Math.abs(s.w - width) < 1 && Math.abs(s.h - height) < 1 ? s : { w: width, h: height }));
  };
  const doc = store.getState().doc;
  const pinned = !!pins || !!onPin;
  const view = size && size.w > 0 && size.h > 0 ? fitStage(doc.stage, size.w, size.h) : null;

  const hostRef = useRef<View>(null);
  /** Where the tap fell inside the plan's box: the DOM's client position on the web, locationX/Y natively. */
  const tapAt = (e: GestureResponderEvent) => {
    const ne = e.nativeEvent as unknown as { locationX?: number; locationY?: number; clientX?: number; clientY?: number };
    let x = ne.locationX ?? NaN;
    let y = ne.locationY ?? NaN;
    const el = hostRef.current as unknown as { getBoundingClientRect?: () => DOMRect } | null;
    if (Platform.OS === 'web' && el?.getBoundingClientRect && ne.clientX !== undefined && ne.clientY !== undefined) {
      const r = el.getBoundingClientRect();
      x = ne.clientX - r.left;
      y = ne.clientY - r.top;
    }
    if (!view || !onPin || !Number.isFinite(x) || !Number.isFinite(y)) return;
    const p = toPlan(view, x, y);
    const items = visible ? doc.items.filter((i) => visible.has(i.id)) : doc.items;
    const hit = hitTest(items, p, 22 / view.scale);
    if (hit) onPin({ itemId: hit.id, label: hit.label || hit.kind });
    else onPin({ point: { x: Math.round(p.x * 100) / 100, y: Math.round(p.y * 100) / 100 } });
  };

  return (
    <View style={styles.host} onLayout={onLayout} testID={testID} ref={hostRef}>
      <EditorContext.Provider value={store}>
        {size ? (
          <PlanCanvas
            key={pinned ? `${Math.round(size.w)}x${Math.round(size.h)}` : 'plan'}
            theme={graphiteTheme}
            units={units}
            lightMap={readings.map}
            boxSelect={false}
            visibleIds={visible}
          />
        ) : null}
      </EditorContext.Provider>
      {pinned && view ? (
        <Pressable
          style={StyleSheet.absoluteFill}
          accessibilityLabel={onPin ? 'Tap the plan to pin a comment to the item or spot under your finger' : 'Plan with comment pins'}
          onPress={tapAt}
          disabled={!onPin}
          testID={testID ? `${testID}-pins` : undefined}
        >
          {(pins ?? []).map((p) => {
            const item = p.itemId ? doc.items.find((i) => i.id === p.itemId) : null;
            const at = item ? anchorOf(item) : p.point;
            if (!at) return null;
            const sp = toScreen(view, at);
            return (
              <View key={p.n} pointerEvents="none" style={[styles.pin, { left: sp.x - 12, top: sp.y - 30 }]} accessibilityLabel={`Comment ${p.n}`}>
                <Text style={styles.pinText}>{p.n}</Text>
              </View>
            );
          })}
          {/* Over the canvas's zoom buttons, which cannot work while pins hold the fitted view. */}
          <View style={styles.legend} pointerEvents="none">
            <Text style={styles.legendText}>{onPin ? 'Tap to pin' : 'Pins'}</Text>
          </View>
        </Pressable>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  host: { flex: 1, minHeight: 200, overflow: 'hidden', borderRadius: 10, borderWidth: 1, borderColor: colours.line },
  pin: { position: 'absolute', width: 24, height: 24, borderRadius: 12, borderBottomLeftRadius: 2, backgroundColor: colours.accent, alignItems: 'center', justifyContent: 'center', borderWidth: 2, borderColor: colours.graphite },
  pinText: { color: colours.accentText, fontFamily: fonts.monoMedium, fontSize: 12 },
  legend: { position: 'absolute', right: 6, top: 6, width: 52, minHeight: 136, borderRadius: 8, backgroundColor: colours.panel, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center', padding: 4 },
  legendText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 11, textAlign: 'center' },
});
