// The phone's bottom sheet: a handle to drag between a peek, half and most of the screen; the canvas stays
// full-screen behind it. The height animates on the UI thread (reanimated).
import type { ReactNode } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import { Gesture, GestureDetector } from 'react-native-gesture-handler';
import Animated, { useAnimatedStyle, useSharedValue, withSpring } from 'react-native-reanimated';
import { colours } from '../../constants/theme';

export const PEEK_PX = 132;

export function BottomSheet({ children, header }: { children: ReactNode; header: ReactNode }) {
  const { height } = useWindowDimensions();
  const stops = [PEEK_PX, Math.round(height * 0.45), Math.round(height * 0.85)];
  const h = useSharedValue(stops[0]!);
  const start = useSharedValue(0);
  const drag = Gesture.Pan()
    .onStart(() => {
      start.value = h.value;
    })
    .onUpdate((e) => {
      h.value = Math.min(stops[2]!, Math.max(stops[0]!, start.value - e.translationY));
    })
    .onEnd((e) => {
      const aim = h.value - e.velocityY * 0.15;
      let best = stops[0]!;
      for (const s of stops) if (Math.abs(s - aim) < Math.abs(best - aim)) best = s;
      h.value = withSpring(best, { damping: 20, stiffness: 180 });
    });
  const style = useAnimatedStyle(() => ({ height: h.value }));
  return (
    <Animated.View style={[s.sheet, style]} accessibilityLabel="Readings and settings">
      <GestureDetector gesture={drag}>
        <View style={s.handleZone} accessibilityRole="adjustable" accessibilityLabel="Drag to resize">
          <View style={s.handle} />
          {header}
        </View>
      </GestureDetector>
      <View style={{ flex: 1 }}>{children}</View>
    </Animated.View>
  );
}

const s = StyleSheet.create({
  sheet: { position: 'absolute', left: 0, right: 0, bottom: 0, backgroundColor: colours.panel, borderTopLeftRadius: 16, borderTopRightRadius: 16, borderTopWidth: 1, borderColor: colours.line, overflow: 'hidden' },
  handleZone: { paddingTop: 8 },
  handle: { alignSelf: 'center', width: 44, height: 5, borderRadius: 3, backgroundColor: colours.line, marginBottom: 6 },
});
