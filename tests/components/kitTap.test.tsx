// A press on a kit button adds its item only when it was a tap: on the phone the row rides in the sheet's header,
// and a hand that drags the sheet up by the row carries the button along under the finger (the e2e inspector test
// once added a flag that way, then edited it instead of the light it had picked). The browser path is
// tests/e2e/inspector-target.test.ts; jsdom carries no pointer positions through react-native-web's Pressable.
import { wasTap } from '../../components/editor/KitAtHand';

test('a tap is a press that ends where it began; a key press (no position) is one too', () => {
  expect(wasTap({ x: 100, y: 700 }, { x: 104, y: 703 })).toBe(true);
  expect(wasTap({ x: 100, y: 700 }, { x: 100, y: 220 })).toBe(false);
  expect(wasTap(null, { x: 100, y: 220 })).toBe(true);
  expect(wasTap({ x: Number.NaN, y: Number.NaN }, { x: Number.NaN, y: Number.NaN })).toBe(true);
});
