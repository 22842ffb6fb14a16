// The plan canvas: draws the setup document it is given (it owns none of it) with the meter's light map
// under it, and turns touches, mouse and wheel into editor actions. Two SVG layers: the static plan
// (items memoised by identity, so a drag re-renders one item) and the interactive overlay.
import { memo, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Platform, Pressable, StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import { Gesture, GestureDetector } from 'react-native-gesture-handler';
import Svg, { G } from 'react-native-svg';
import type { LightMapResult } from '../calc';
import type { Item, ItemOf } from '../model/document';
import type { Point } from '../model/geometry';
import { accessibleName, anchorOf } from '../model/kinds';
import { M_PER_FT, type Units } from '../model/units';
import { pressDown, pressMove, pressUp, tap, type Press } from './gestures';
import { Beams } from './layers/Beams';
import { Grid } from './layers/Grid';
import { HeatCanvas } from './layers/HeatCanvas';
import { LightMapLayer } from './layers/LightMapLayer';
import { Overlay } from './layers/Overlay';
import { useEditor, useEditorStore } from './state/store';
import { ItemView, type PlanTheme } from './views';
import { fitStage, panBy, scaleBarLength, toPlan, toScreen, zoomAt, type Viewport } from './viewport';

export type PlanCanvasProps = {
  theme: PlanTheme;
  units: Units;
  lightMap: LightMapResult | null;
  /** Mouse-first (wide screen): empty-space drags draw a selection box. */
  boxSelect: boolean;
  /** Keys held on a keyboard (Space pans, Shift adds to the selection). */
  keys?: { current: { space: boolean; shift: boolean } };
  /** More buttons for the floating column beside zoom (the screen's view toggles). */
  controls?: React.ReactNode;
  /** Pixels at the bottom covered by something else (the phone's sheet), left out when fitting the stage. */
  insetBottom?: number;
  /** Show only these items (the plan as it stands at one step); null shows everything. */
  visibleIds?: Set<string> | null;
  testID?: string;
};

export const PlanCanvas = memo(function PlanCanvas({ theme, units, lightMap, boxSelect, keys, visibleIds, insetBottom = 0, controls, testID }: PlanCanvasProps) {
  const store = useEditorStore();
  const allItems = useEditor((s) => s.doc.items);
  const items = useMemo(() => (visibleIds ? allItems.filter((i) => visibleIds.has(i.id)) : allItems), [allItems, visibleIds]);
  // Presses reach only what is shown (a step view hides items placed later).
  const shownRef = useRef<Item[] | undefined>(undefined);
  shownRef.current = visibleIds ? items : undefined;
  const stage = useEditor((s) => s.doc.stage);
  const selection = useEditor((s) => s.selection);
  const readOnly = useEditor((s) => s.readOnly);
  const [size, setSize] = useState({ w: 0, h: 0 });
  const [view, setView] = useState<Viewport | null>(null);
  const viewRef = useRef<Viewport | null>(null);
  viewRef.current = view;
  const pressRef = useRef<Press>({ mode: 'idle' });
  const [box, setBox] = useState<{ from: Point; to: Point } | null>(null);
  const pinchRef = useRef<{ start: Viewport; scale: number } | null>(null);
  const downAt = useRef<Point | null>(null);

  const onLayout = (e: LayoutChangeEvent) => {
    const { width: w, height: h } = e.nativeEvent.layout;
    setSize({ w, h });
    setView((v) => v ?? (w > 0 && h > insetBottom ? fitStage(stage, w, h - insetBottom) : null));
  };

  const tolerance = useCallback((pointer: 'touch' | 'mouse') => (pointer === 'touch' ? 22 : 10) / (viewRef.current?.scale ?? 80), []);

  const gesture = useMemo(() => {
    const at = (x: number, y: number) => toPlan(viewRef.current!, x, y);
    const drag = Gesture.Pan()
      .runOnJS(true)
      .maxPointers(1)
      .minDistance(3)
      // Where the finger went down: on the web the pan's translation only counts from activation, so the
      // press point is taken at touch-down, not worked back from the translation.
      .onBegin((e) => {
        downAt.current = { x: e.x, y: e.y };
      })
      .onStart((e) => {
        if (!viewRef.current) return;
        const sx = downAt.current?.x ?? e.x - e.translationX;
        const sy = downAt.current?.y ?? e.y - e.translationY;
        pressRef.current = pressDown(store, viewRef.current, at(sx, sy), { x: sx, y: sy }, {
          toleranceM: tolerance(boxSelect ? 'mouse' : 'touch'),
          boxSelect,
          panKey: keys?.current.space ?? false,
          additive: keys?.current.shift ?? false,
          items: shownRef.current,
        });
        const r = pressMove(store, pressRef.current, at(e.x, e.y), { x: e.x, y: e.y });
        if (r.view) setView(r.view);
      })
      .onUpdate((e) => {
        if (!viewRef.current) return;
        const r = pressMove(store, pressRef.current, at(e.x, e.y), { x: e.x, y: e.y });
        pressRef.current = r.press;
        if (r.view) setView(r.view);
        if (r.press.mode === 'box') setBox({ from: r.press.from, to: r.press.to });
      })
      .onFinalize(() => {
        pressRef.current = pressUp(store, pressRef.current);
        setBox(null);
      });
    const twoFingerPan = Gesture.Pan()
      .runOnJS(true)
      .minPointers(2)
      .onChange((e) => setView((v) => (v ? panBy(v, e.changeX, e.changeY) : v)));
    const pinch = Gesture.Pinch()
      .runOnJS(true)
      .onStart(() => {
        if (viewRef.current) pinchRef.current = { start: viewRef.current, scale: 1 };
      })
      .onUpdate((e) => {
        const p = pinchRef.current;
        if (p) setView(zoomAt(p.start, e.scale, e.focalX, e.focalY));
      })
      .onEnd(() => {
        pinchRef.current = null;
      });
    const press = Gesture.Tap()
      .runOnJS(true)
      .maxDistance(3)
      .onEnd((e, ok) => {
        if (ok && viewRef.current) tap(store, at(e.x, e.y), { toleranceM: tolerance(boxSelect ? 'mouse' : 'touch'), additive: keys?.current.shift ?? false, items: shownRef.current });
      });
    // A long press adds the item under the finger to the selection (multi-select on touch).
    const hold = Gesture.LongPress()
      .runOnJS(true)
      .minDuration(450)
      .onStart((e) => {
        if (viewRef.current) tap(store, at(e.x, e.y), { toleranceM: tolerance('touch'), additive: true, items: shownRef.current });
      });
    return Gesture.Simultaneous(Gesture.Exclusive(drag, hold, press), pinch, twoFingerPan);
  }, [store, boxSelect, keys, tolerance]);

  // Wheel zoom on the web (and trackpad pinch, which browsers send as ctrl+wheel).
  const hostRef = useRef<View>(null);
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const el = hostRef.current as unknown as HTMLElement | null;
    if (!el?.addEventListener) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      const factor = Math.exp(-e.deltaY * (e.ctrlKey ? 0.01 : 0.0015));
      setView((v) => (v ? zoomAt(v, factor, e.clientX - r.left, e.clientY - r.top) : v));
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, []);

  const lights = useMemo(() => items.filter((i): i is ItemOf<'light'> => i.kind === 'light'), [items]);
  const selected = useMemo(() => new Set(selection), [selection]);

  return (
    <View style={[styles.host, { backgroundColor: theme.gridMinor }]} onLayout={onLayout} ref={hostRef} testID={testID}>
      {view ? <View pointerEvents="none" style={[styles.stage, { backgroundColor: theme.background, left: view.tx, top: view.ty, width: stage.widthM * view.scale, height: stage.depthM * view.scale }]} /> : null}
      {view && lightMap ? <HeatCanvas map={lightMap} view={view} /> : null}
      {view ? (
        <GestureDetector gesture={gesture}>
          <View style={StyleSheet.absoluteFill} collapsable={false}>
            <Svg width={size.w} height={size.h}>
              <G transform={`translate(${view.tx} ${view.ty}) scale(${view.scale})`}>
                <Grid stage={stage} theme={theme} />
                {lightMap ? <LightMapLayer map={lightMap} ink={theme.ink} /> : null}
                <Beams lights={lights} />
                {items.map((it) => (
                  <ItemView key={it.id} item={it} theme={theme} units={units} />
                ))}
                <Overlay items={items} selection={selection} box={box} theme={theme} scale={view.scale} readOnly={readOnly} />
              </G>
            </Svg>
          </View>
        </GestureDetector>
      ) : null}
      {view ? <A11yLayer items={items} view={view} selected={selected} /> : null}
      {view ? <ScaleBar scale={view.scale} units={units} theme={theme} bottom={insetBottom + 12} /> : null}
      {view ? (
        <View style={styles.zoom}>
          <ZoomButton label="Zoom in" text="+" onPress={() => setView((v) => v && zoomAt(v, 1.25, size.w / 2, size.h / 2))} />
          <ZoomButton label="Zoom out" text="−" onPress={() => setView((v) => v && zoomAt(v, 0.8, size.w / 2, size.h / 2))} />
          <ZoomButton label="Fit the stage" text="⤢" onPress={() => setView(fitStage(stage, size.w, size.h - insetBottom))} />
          {controls}
        </View>
      ) : null}
    </View>
  );
});

/** Every item is also a focusable element with its name, over its glyph: keyboard and screen-reader users
 *  reach items with Tab, and focusing one selects it. */
function A11yLayer({ items, view, selected }: { items: Item[]; view: Viewport; selected: Set<string> }) {
  return (
    <View style={StyleSheet.absoluteFill} pointerEvents="box-none">
      {items.map((it) => {
        const p = toScreen(view, anchorOf(it));
        return <Marker key={it.id} id={it.id} name={accessibleName(it)} x={p.x} y={p.y} selected={selected.has(it.id)} />;
      })}
    </View>
  );
}

const Marker = memo(function Marker({ id, name, x, y, selected }: { id: string; name: string; x: number; y: number; selected: boolean }) {
  const store = useEditorStore();
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={name}
      accessibilityState={{ selected }}
      onFocus={() => store.dispatch('select', { ids: [id] })}
      onPress={() => store.dispatch('select', { ids: [id] })}
      pointerEvents="none"
      style={[styles.a11y, { left: x - 10, top: y - 10 }]}
      testID={`item-${id}`}
    />
  );
});

function ScaleBar({ scale, units, theme, bottom }: { scale: number; units: Units; theme: PlanTheme; bottom: number }) {
  const unitM = units === 'metric' ? 1 : M_PER_FT;
  const n = scaleBarLength(scale, unitM);
  const px = n * unitM * scale;
  return (
    <View style={[styles.scaleBar, { bottom }]} pointerEvents="none" accessibilityLabel={`Scale: the bar is ${n} ${units === 'metric' ? 'm' : 'ft'}`}>
      <View style={{ width: px, height: 6, borderLeftWidth: 2, borderRightWidth: 2, borderBottomWidth: 2, borderColor: theme.ink }} />
      <Text style={[styles.scaleText, { color: theme.ink }]}>
        {n} {units === 'metric' ? 'm' : 'ft'}
      </Text>
    </View>
  );
}

function ZoomButton({ label, text, onPress }: { label: string; text: string; onPress: () => void }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} style={styles.zoomButton}>
      <Text style={styles.zoomText}>{text}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  host: { flex: 1, overflow: 'hidden' },
  stage: { position: 'absolute' },
  a11y: { position: 'absolute', width: 20, height: 20, borderRadius: 10 },
  scaleBar: { position: 'absolute', left: 12, bottom: 12, alignItems: 'flex-start', gap: 2 },
  scaleText: { fontFamily: 'IBMPlexMono_400Regular', fontSize: 12 },
  zoom: { position: 'absolute', right: 10, top: 10, gap: 6 },
  zoomButton: { width: 40, height: 40, borderRadius: 8, backgroundColor: '#26292ecc', alignItems: 'center', justifyContent: 'center', borderWidth: 1, borderColor: '#3c4148' },
  zoomText: { color: '#ece9e2', fontSize: 20, fontFamily: 'IBMPlexSans_500Medium' },
});
