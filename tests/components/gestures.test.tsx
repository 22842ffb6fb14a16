// Proves the harness runs gesture handler as the web build does (no reanimated on the web: callbacks run on
// the JS thread, as the plan's own gestures do with runOnJS): a pan moves a view, whose position reaches the
// page as a CSS transform, and the end of the gesture reports back to React state.
import { act, render, screen } from '@testing-library/react';
import { useRef, useState } from 'react';
import { Text, View } from 'react-native';
import { Gesture, GestureDetector, State } from 'react-native-gesture-handler';
import { fireGestureHandler, getByGestureTestId } from 'react-native-gesture-handler/jest-utils';

/** A light on a rail: drag it sideways; where it comes to rest is shown in metres, 100 px to the metre. */
function LightOnRail({ startPx = 0 }: { startPx?: number }) {
  const [x, setX] = useState(startPx);
  const from = useRef(startPx);
  const [restedAt, setRestedAt] = useState(startPx);
  const pan = Gesture.Pan()
    .withTestId('rail')
    .runOnJS(true)
    .onStart(() => {
      from.current = x;
    })
    .onUpdate((e) => setX(from.current + e.translationX))
    .onEnd((e) => setRestedAt(from.current + e.translationX));
  return (
    <View>
      <GestureDetector gesture={pan}>
        <View testID="light" style={{ width: 20, height: 20, transform: [{ translateX: x }] }} />
      </GestureDetector>
      <Text>at {(restedAt / 100).toFixed(2)} m</Text>
    </View>
  );
}

const transform = () => screen.getByTestId('light').style.transform;

describe('GestureDetector on the web', () => {
  it('renders the start position as a CSS transform', () => {
    render(<LightOnRail startPx={30} />);
    expect(screen.getByText('at 0.30 m')).toBeInTheDocument();
    expect(transform()).toBe('translateX(30px)');
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
    expect(transform()).toBe('translateX(125px)');
    expect(await screen.findByText('at 1.25 m')).toBeInTheDocument();
  });
});
