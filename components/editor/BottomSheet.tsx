// The phone's bottom sheet: a handle row to drag (sheetDrag.tsx; on the web sheetDrag.web.tsx, with no gesture
// handler) between a peek, half and most of the screen; the canvas stays full-screen behind it. The height
// follows the finger and springs to the nearest stop with React Native's Animated (on the JS thread: the web
// build carries no reanimated, and a height cannot animate natively anyway).
// The screen can ask for a stop (`request`: a tap on an item opens its settings at half height) and hears the
// height as it changes (`onHeight`), so the plan re-fits to the space above the sheet.
import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Animated, Pressable, StyleSheet, View, useWindowDimensions } from 'react-native';
import { colours } from '../../constants/theme';
import { SheetDrag } from './sheetDrag';
import type { SheetDragHandlers } from './sheetDragTypes';

/** The lowest height: the handle, the kit at hand, the meter's line and the tabs. */
export const PEEK_PX = 184;
/** The middle stop, as a share of the window's height: an item's settings open here, with the plan re-fitted in
 *  the 45 % above (less the top bar), so the tapped item stays in view. */
export const HALF_SHARE = 0.55;
/** The highest stop, as a share of the window's height. */
export const HIGH_SHARE = 0.85;

/** The sheet's resting heights for a window height: peek, half, most. */
function sheetStops(height: number): [number, number, number] {
  return [PEEK_PX, Math.round(height * HALF_SHARE), Math.round(height * HIGH_SHARE)];
}

/** The stop nearest to where a fling would carry the sheet (common practice: a short look ahead at the speed). */
function nearestStop(stops: number[], height: number, velocityY: number) {
  const aim = height - velocityY * 0.15;
  let best = stops[0]!;
  for (const s of stops) if (Math.abs(s - aim) < Math.abs(best - aim)) best = s;
  return best;
}

/** The stops in words, for the handle's name. */
const STOP_WORDS = ['low', 'half', 'high'] as const;

export type SheetRequest = { stop: 0 | 1 | 2; n: number };

export function BottomSheet({ children, header, request, onHeight }: { children: ReactNode; header: ReactNode; request?: SheetRequest | null; onHeight?: (px: number) => void }) {
  const { height } = useWindowDimensions();
  const stops = sheetStops(height);
  const h = useRef(new Animated.Value(stops[0])).current;
  // The height now (Animated.Value keeps it private) and at the start of a drag.
  const now = useRef<number>(stops[0]);
  const start = useRef(0);
  const spring = useRef<Animated.CompositeAnimation | null>(null);
  const set = (v: number) => {
    now.current = v;
    h.setValue(v);
  };
  // Which stop the sheet rests nearest (for the handle's name), updated when a move settles.
  const [stopIndex, setStopIndex] = useState(0);
  const springTo = (target: number) => {
    now.current = target;
    setStopIndex(stops.indexOf(target) >= 0 ? stops.indexOf(target) : 0);
    spring.current = Animated.spring(h, { toValue: target, damping: 20, stiffness: 180, mass: 1, useNativeDriver: false });
    spring.current.start();
  };
  // Tell the screen the height as it changes (whole pixels only), the latest callback each time.
  const heard = useRef(onHeight);
  heard.current = onHeight;
  useEffect(() => {
    let last = -1;
    const id = h.addListener(({ value }) => {
      const px = Math.round(value);
      if (px !== last) {
        last = px;
        heard.current?.(px);
      }
    });
    return () => h.removeListener(id);
  }, [h]);
  const drag: SheetDragHandlers = {
    start: () => {
      spring.current?.stop();
      // Caught mid-spring, the drag starts from where the sheet is.
      h.stopAnimation((v) => (now.current = v));
      start.current = now.current;
    },
    move: (dy) => set(Math.min(stops[2], Math.max(stops[0], start.current - dy))),
    end: (velocityY) => springTo(nearestStop(stops, now.current, velocityY)),
  };
  // A stop asked for by the screen (never lowers a sheet the user raised higher).
  const n = request?.n;
  useEffect(() => {
    if (!request) return;
    const target = stops[request.stop];
    if (now.current < target - 1) {
      spring.current?.stop();
      springTo(target);
    }
  }, [n]); // eslint-disable-line react-hooks/exhaustive-deps
  return (
    <Animated.View style={[s.sheet, { height: h }]} accessibilityLabel="Readings and settings">
      <SheetDrag handlers={drag}>
        {/* The drag zone carries no role: the tabs inside it are controls of their own, and the handle is a
            separate button that steps the sheet through its heights (a keyboard and a screen reader's way). */}
        <View style={s.handleZone}>
          <Pressable
            role="button"
            aria-label={`Sheet height: ${STOP_WORDS[stopIndex]}. Change`}
            onPress={() => springTo(stops[(stopIndex + 1) % stops.length]!)}
            style={s.handleHit}
            testID="sheet-handle"
          >
            <View style={s.handle} />
          </Pressable>
          {header}
        </View>
      </SheetDrag>
      <View style={{ flex: 1 }}>{children}</View>
    </Animated.View>
  );
}

const s = StyleSheet.create({
  sheet: { position: 'absolute', left: 0, right: 0, bottom: 0, backgroundColor: colours.panel, borderTopLeftRadius: 16, borderTopRightRadius: 16, borderTopWidth: 1, borderColor: colours.line, overflow: 'hidden' },
  handleZone: {},
  // A 88 × 44 px target around the 5 px bar (the kit's buttons sit right under it, so it needs the full 44 px).
  handleHit: { alignSelf: 'center', width: 88, height: 44, alignItems: 'center', justifyContent: 'center' },
  handle: { width: 44, height: 5, borderRadius: 3, backgroundColor: colours.line },
});
