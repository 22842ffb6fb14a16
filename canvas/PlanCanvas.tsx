// The plan canvas: renders what the editor says (its document, camera, selection and the items shown) with
// the meter's light map under it, and hands touches, mouse and wheel to the editor's tools and camera
// actions. It owns no state of its own. Each item, beam and marker subscribes to its own item, so a drag
// re-renders the dragged item's view, its beam and the handles — not the plan. Overlays (comment pins) are
// children drawn in screen space with the same camera (`usePlanCamera`).
import { createContext, memo, useCallback, useContext, useEffect, useMemo, useRef, useSyncExternalStore } from 'react';
import { Platform, Pressable, StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import Svg, { G } from 'react-native-svg';
import { useShallow } from 'zustand/react/shallow';
import type { LightMapResult } from '../calc';
import type { Item, ItemOf } from '../model/document';
import type { Point } from '../model/geometry';
import { accessibleName, anchorOf } from '../model/kinds';
import { M_PER_FT, type Units } from '../model/units';
import { pinchCamera, scaleBarLength, toScreen, type Camera } from './editor/camera';
import { itemAt, planAt } from './editor/hit';
import { useEditor, useEditorApi } from './editor/react';
import { itemById, type PointerKind } from './editor/state';
import { gridMajorM, gridStepM } from './editor/snap';
import { Beam } from './layers/Beams';
import { attachWebPinch } from './webPinch';
import { PlanGestures, type PlanGestureHandlers } from './planGestures';
import { beamClipOf, sketchBeam } from '../drawing/plan';
import { sketchItem } from '../drawing/glyphs';
import { createDragLayer } from './dragLayer';
import { coalesceMoves } from './moveCoalescer';
import { DragLayerContext, useItemDrag } from './dragViews';
import { Grid } from './layers/Grid';
import { Handles } from './layers/Handles';
import { HeatCanvas } from './layers/HeatCanvas';
import { Labels } from './layers/Labels';
import { LightMapLayer } from './layers/LightMapLayer';
import { Overlay } from './layers/Overlay';
import { ItemView, type PlanTheme } from './views';

/** A light map that changes at its own pace (the live meter's): only the map's own layers subscribe to it, so
 *  a new map re-renders the tint and the contours, not the plan. */
export type LightMapSource = { get: () => LightMapResult | null; subscribe: (onChange: () => void) => () => void };

export type PlanCanvasProps = {
  theme: PlanTheme;
  units: Units;
  /** A fixed map (read-only views) or a live one. */
  lightMap: LightMapResult | null | LightMapSource;
  /** More buttons for the floating column beside zoom (the screen's view toggles). */
  controls?: React.ReactNode;
  /** Pixels at the bottom covered by something else (the phone's sheet), left out when fitting the stage. */
  insetBottom?: number;
  /** A tap on the plan goes here instead of selecting (pinning a comment): the plan point and the topmost
   *  item under it. */
  onTap?: (at: Point, item: Item | null) => void;
  /** Drawn over the plan in screen pixels (comment pins); they read the camera with usePlanCamera. */
  children?: React.ReactNode;
  testID?: string;
};

/** The camera and a plan → screen transform, for overlays. */
/** The prefix of the plan's item markers' test ids (`item-<id>`). A second, small plan on the same screen (the
 *  comment pins' plan beside the editor's) uses another, so an id names one element. */
export const ItemTestIds = createContext('item-');

/** A second plan beside the one a screen already has (the comment pins' plan in the editor, on the share
 *  page): it is hidden from assistive tech, which reaches the items on the main plan and the pins in the
 *  thread's words; its markers and zoom buttons take no tab stop (tabIndex -1: react-native-web's Pressable
 *  ignores `focusable`). Pointers still zoom, pan and pin on it. */
export const SecondaryPlan = createContext(false);

export function usePlanCamera(): Camera | null {
  return useEditor((s) => s.camera);
}

const isSource = (m: PlanCanvasProps['lightMap']): m is LightMapSource => !!m && typeof (m as LightMapSource).get === 'function';
const noSubscribe = () => () => {};
/** The map as it stands now, re-rendering the caller when a live source brings a new one. */
function useLightMap(m: PlanCanvasProps['lightMap']): LightMapResult | null {
  const source = isSource(m) ? m : null;
  const fixed = isSource(m) ? null : m;
  return useSyncExternalStore(source ? source.subscribe : noSubscribe, source ? source.get : () => fixed, source ? source.get : () => fixed);
}

/** Per-items-array answers, so a selector run on every store change (each move of a drag) returns the very
 *  same array while the document and the items shown stay as they were: no filtering, no shallow compare. */
function cachedBy<T>(compute: (items: readonly Item[], visible: ReadonlySet<string> | null) => T) {
  const cache = new WeakMap<readonly Item[], { visible: ReadonlySet<string> | null; value: T }>();
  return (items: readonly Item[], visible: ReadonlySet<string> | null): T => {
    const hit = cache.get(items);
    if (hit && hit.visible === visible) return hit.value;
    const value = compute(items, visible);
    cache.set(items, { visible, value });
    return value;
  };
}
const shownIdsOf = cachedBy((items, visible) => items.filter((i) => !visible || visible.has(i.id)).map((i) => i.id));
const lightIdsOf = cachedBy((items, visible) => items.filter((i) => i.kind === 'light' && (!visible || visible.has(i.id))).map((i) => i.id));
const wallsOf = cachedBy((items) => items.filter((i) => i.kind === 'wall'));

export const PlanCanvas = memo(function PlanCanvas({ theme, units, lightMap, insetBottom = 0, controls, onTap, children, testID }: PlanCanvasProps) {
  const editor = useEditorApi();
  const shownIds = useEditor(useShallow((s) => shownIdsOf(s.doc.items, s.visibleIds)));
  const lightIds = useEditor(useShallow((s) => lightIdsOf(s.doc.items, s.visibleIds)));
  const stage = useEditor((s) => s.doc.stage);
  const camera = useEditor((s) => s.camera);
  const size = useEditor(useShallow((s) => s.viewport));
  const onTapRef = useRef(onTap);
  onTapRef.current = onTap;
  // The drag layer of this plan: the moved items' views follow the hand without React.
  const dragLayer = useMemo(() => createDragLayer(editor), [editor]);
  useEffect(() => () => dragLayer.dispose(), [dragLayer]);

  useEffect(() => {
    if (size.insetBottom !== insetBottom) editor.dispatch('setViewport', { w: size.w, h: size.h, insetBottom });
  }, [editor, insetBottom, size]);
  // A drag snaps to the grid drawn: of metres, or of feet and inches.
  useEffect(() => editor.dispatch('setInput', { units }), [editor, units]);

  const onLayout = (e: LayoutChangeEvent) => {
    const { width: w, height: h } = e.nativeEvent.layout;
    editor.dispatch('setViewport', { w, h, insetBottom });
  };

  const gestures = useMemo((): PlanGestureHandlers => {
    // A mouse on a wide screen is precise and draws boxes; elsewhere presses are treated as a finger.
    const kind = (): PointerKind => (editor.getState().input.boxSelect ? 'mouse' : 'touch');
    // Pointer moves reach the editor at most once an animation frame, the newest (moveCoalescer.ts); a
    // release flushes the waiting move first.
    const moves = coalesceMoves((p: Point) => editor.pointer.move({ screen: p, pointer: kind() }));

    // A pinch keeps the plan point first under the fingers under them (pinchCamera), panning as they move;
    // two fingers that only slide pan until a pinch takes over. (On the web: webPinch.ts.)
    let pinchStart: { camera: Camera; focal: Point } | null = null;
    return {
      dragStart: (from, to) => {
        editor.pointer.down({ screen: from, pointer: kind() });
        moves.queue(to);
      },
      dragMove: moves.queue,
      dragRelease: (at) => moves.flush(at),
      dragEnd: (at) => {
        moves.flush();
        editor.pointer.up({ screen: at, pointer: kind() });
      },
      tap: (screen) => {
        const tapHandler = onTapRef.current;
        if (tapHandler) {
          const s = editor.getState();
          const at = planAt(s, screen);
          if (at) tapHandler(at, itemAt(s, screen, 'touch'));
          return;
        }
        editor.pointer.tap({ screen, pointer: kind() });
      },
      // A long press adds the item under the finger to the selection (multi-select on touch).
      hold: (screen) => editor.pointer.hold({ screen, pointer: 'touch' }),
      pinchStart: (focal) => {
        const camera = editor.getState().camera;
        pinchStart = camera ? { camera, focal } : null;
      },
      pinchUpdate: (scale, focal) => {
        if (pinchStart) editor.dispatch('setCamera', { camera: pinchCamera(pinchStart.camera, pinchStart.focal, scale, focal) });
      },
      pinchEnd: () => {
        pinchStart = null;
      },
      twoFingerPan: (dx, dy) => {
        if (!pinchStart) editor.dispatch('pan', { dx, dy });
      },
    };
  }, [editor]);

  // Wheel zoom on the web (and trackpad pinch, which browsers send as ctrl+wheel).
  const hostRef = useRef<View>(null);
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const el = hostRef.current as unknown as HTMLElement | null;
    if (!el?.addEventListener) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      editor.dispatch('zoom', { factor: Math.exp(-e.deltaY * (e.ctrlKey ? 0.01 : 0.0015)), at: { x: e.clientX - r.left, y: e.clientY - r.top } });
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    const detachPinch = attachWebPinch(el, editor);
    return () => {
      detachPinch();
      el.removeEventListener('wheel', onWheel);
    };
  }, [editor]);

  return (
    <View style={[styles.host, { backgroundColor: theme.gridMinor }]} onLayout={onLayout} ref={hostRef} testID={testID}>
      {camera ? <View pointerEvents="none" style={[styles.stage, { backgroundColor: theme.background, left: camera.tx, top: camera.ty, width: stage.widthM * camera.scale, height: stage.depthM * camera.scale }]} /> : null}
      {camera ? <MapTint source={lightMap} camera={camera} /> : null}
      {camera ? (
        <DragLayerContext.Provider value={dragLayer}>
        <PlanGestures handlers={gestures}>
          <View style={StyleSheet.absoluteFill} collapsable={false}>
            <Svg width={size.w} height={size.h}>
              <G transform={`translate(${camera.tx} ${camera.ty}) scale(${camera.scale})`}>
                <Grid stage={stage} theme={theme} stepM={gridStepM(camera.scale, units)} majorM={gridMajorM(units)} />
                <MapLines source={lightMap} ink={theme.ink} units={units} />
                <G pointerEvents="none">
                  {lightIds.map((id) => (
                    <PlanBeam key={id} id={id} />
                  ))}
                </G>
                {shownIds.map((id) => (
                  <PlanItem key={id} id={id} theme={theme} units={units} />
                ))}
                <Labels theme={theme} units={units} />
                <Overlay theme={theme} />
              </G>
              <Handles theme={theme} units={units} />
            </Svg>
          </View>
        </PlanGestures>
        </DragLayerContext.Provider>
      ) : null}
      {camera ? <A11yLayer ids={shownIds} /> : null}
      {camera ? children : null}
      {camera ? <ScaleBar units={units} theme={theme} bottom={insetBottom + 12} /> : null}
      {camera ? <ZoomColumn controls={controls} /> : null}
    </View>
  );
});

/** The light map's tint under the plan: re-renders when a new map arrives (or the camera moves). */
const MapTint = memo(function MapTint({ source, camera }: { source: PlanCanvasProps['lightMap']; camera: Camera }) {
  const map = useLightMap(source);
  return map ? <HeatCanvas map={map} view={camera} /> : null;
});

const MapLines = memo(function MapLines({ source, ink, units }: { source: PlanCanvasProps['lightMap']; ink: string; units: Units }) {
  const map = useLightMap(source);
  return map ? <LightMapLayer map={map} ink={ink} units={units} /> : null;
});

/** One item's glyph: subscribes to that item only. */
const PlanItem = memo(function PlanItem({ id, theme, units }: { id: string; theme: PlanTheme; units: Units }) {
  const settled = useEditor((s) => itemById(s, id));
  const draw = useCallback((i: Item) => sketchItem(i, { theme, units }), [theme, units]);
  // A drag moves the glyph through the drag layer, not through React (see dragViews.ts).
  const { shell, preview, live } = useItemDrag(id, draw);
  const testIdPrefix = useContext(ItemTestIds);
  const item = live ?? settled;
  if (!item) return null;
  return (
    <>
      <G ref={shell as never} testID={`${testIdPrefix}glyph-${id}`}>
        <ItemView item={item} theme={theme} units={units} />
      </G>
      <G ref={preview as never} />
    </>
  );
});

const PlanBeam = memo(function PlanBeam({ id }: { id: string }) {
  const settled = useEditor((s) => itemById(s, id));
  const walls = useEditor((s) => wallsOf(s.doc.items, null));
  const stage = useEditor((s) => s.doc.stage);
  const clip = useMemo(() => beamClipOf({ items: walls, stage }), [walls, stage]);
  const draw = useCallback((i: Item) => (i.kind === 'light' ? sketchBeam(i, clip) : null), [clip]);
  // The walls clip a beam differently wherever it stands: a moved beam is drawn afresh, never shifted.
  const { shell, preview, live } = useItemDrag(id, draw, false);
  const item = live ?? settled;
  return (
    <>
      <G ref={shell as never}>{item?.kind === 'light' ? <Beam light={item as ItemOf<'light'>} clip={clip} /> : null}</G>
      <G ref={preview as never} />
    </>
  );
});

/** Every item is also a focusable element with its name, over its glyph: keyboard and screen-reader users
 *  reach items with Tab, and focusing one selects it. The markers stand where the document has the items:
 *  a drag moves them once, at release, not with every move of the hand. */
const A11yLayer = memo(function A11yLayer({ ids: shown }: { ids: string[] }) {
  return (
    <View style={StyleSheet.absoluteFill} pointerEvents="box-none">
      {shown.map((id) => (
        <Marker key={id} id={id} />
      ))}
    </View>
  );
});

const Marker = memo(function Marker({ id }: { id: string }) {
  const editor = useEditorApi();
  const item = useEditor((s) => itemById(s, id));
  const camera = useEditor((s) => s.camera);
  const selected = useEditor((s) => s.selection.includes(id));
  const testIdPrefix = useContext(ItemTestIds);
  const secondary = useContext(SecondaryPlan);
  if (!item || !camera) return null;
  const p = toScreen(camera, anchorOf(item));
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={accessibleName(item)}
      accessibilityState={{ selected }}
      aria-pressed={selected}
      onFocus={() => editor.dispatch('select', { ids: [id] })}
      onPress={() => {
        editor.dispatch('select', { ids: [id] });
        editor.opens.request(id);
      }}
      pointerEvents="none"
      focusable={!secondary}
      // react-native-web's Pressable sets its own tab stop unless given a tabIndex: a hidden plan's marker
      // takes none (axe: aria-hidden-focus).
      tabIndex={secondary ? -1 : undefined}
      style={[styles.a11y, { left: p.x - 12, top: p.y - 12 }]}
      testID={`${testIdPrefix}${id}`}
    />
  );
});

const ScaleBar = memo(function ScaleBar({ units, theme, bottom }: { units: Units; theme: PlanTheme; bottom: number }) {
  const scale = useEditor((s) => s.camera?.scale ?? 80);
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
});

/** Zoom, fit and the screen's own view buttons (it re-renders when those change, not with the plan). */
const ZoomColumn = memo(function ZoomColumn({ controls }: { controls?: React.ReactNode }) {
  const editor = useEditorApi();
  const focusable = !useContext(SecondaryPlan);
  return (
    <View style={styles.zoom}>
      <ZoomButton label="Zoom in" text="+" focusable={focusable} onPress={() => editor.dispatch('zoom', { factor: 1.25 })} />
      <ZoomButton label="Zoom out" text="−" focusable={focusable} onPress={() => editor.dispatch('zoom', { factor: 0.8 })} />
      <ZoomButton label="Fit the stage" text="⤢" focusable={focusable} onPress={() => editor.dispatch('fit')} />
      {controls}
    </View>
  );
});

function ZoomButton({ label, text, onPress, focusable }: { label: string; text: string; onPress: () => void; focusable: boolean }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} focusable={focusable} tabIndex={focusable ? undefined : -1} style={styles.zoomButton}>
      <Text style={styles.zoomText}>{text}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  host: { flex: 1, overflow: 'hidden' },
  stage: { position: 'absolute' },
  a11y: { position: 'absolute', width: 24, height: 24, borderRadius: 12 },
  scaleBar: { position: 'absolute', left: 12, bottom: 12, alignItems: 'flex-start', gap: 2 },
  scaleText: { fontFamily: 'IBMPlexMono_400Regular', fontSize: 12 },
  zoom: { position: 'absolute', right: 10, top: 10, gap: 6 },
  zoomButton: { width: 40, height: 40, borderRadius: 8, backgroundColor: '#26292ecc', alignItems: 'center', justifyContent: 'center', borderWidth: 1, borderColor: '#3c4148' },
  zoomText: { color: '#ece9e2', fontSize: 20, fontFamily: 'IBMPlexSans_500Medium' },
});
