// Proves the harness runs gesture handler and reanimated together: a pan gesture drives a shared value,
// the shared value drives an animated style, and the end of the gesture reports back to React state.
import { act, render, screen } from '@testing-library/react';
import { useState } from 'react';
import { Text, View } from 'react-native';
import { Gesture, GestureDetector, GestureHandlerRootView, State } from 'react-native-gesture-handler';
import { fireGestureHandler, getByGestureTestId } from 'react-native-gesture-handler/jest-utils';
import Animated, { getAnimatedStyle, useAnimatedStyle, useSharedValue } from 'react-native-reanimated';
import { scheduleOnRN } from 'react-native-worklets';

/** A light on a rail: drag it sideways; where it comes to rest is shown in metres, 100 px to the metre. */
function LightOnRail({ startPx = 0 }: { startPx?: number }) {
  const x = useSharedValue(startPx);
  const from = useSharedValue(startPx);
  const [restedAt, setRestedAt] = useState(startPx);
  const pan = Gesture.Pan()
    .withTestId('rail')
    .onStart(() => {
      from.value = x.value;
    })
    .onUpdate((e) => {
      x.value = from.value + e.translationX;
    })
    .onEnd(() => {
      scheduleOnRN(setRestedAt, x.value);
    });
  const style = useAnimatedStyle(() => ({ transform: [{ translateX: x.value }] }));
  return (
    <GestureHandlerRootView>
      <GestureDetector gesture={pan}>
        <Animated.View testID="light" style={[{ width: 20, height: 20 }, style]} />
      </GestureDetector>
      <View>
        <Text>at {(restedAt / 100).toFixed(2)} m</Text>
      </View>
    </GestureHandlerRootView>
  );
}

const translateX = () => (getAnimatedStyle(screen.getByTestId('light')) as { transform?: { translateX: number }[] }).transform?.[0]?.translateX;

describe('GestureDetector with a reanimated shared value', () => {
  it('renders with the shared value applied', () => {
    render(<LightOnRail startPx={30} />);
    expect(screen.getByText('at 0.30 m')).toBeInTheDocument();
    expect(translateX()).toBe(30);
  });

  it('moves with a pan and reports where it rests', async () => {
    render(<LightOnRail startPx={30} />);
    await act(async () => {
      fireGestureHandler(getByGestureTestId('rail'), [
        { state: State.BEGAN, translationX: 0 },
        { state: State.ACTIVE, translationX: 40 },
        { translationX: 95 },
        { state: State.END, translationX: 95 },
      ]);
    });
    expect(translateX()).toBe(125);
    expect(await screen.findByText('at 1.25 m')).toBeInTheDocument();
  });
});
