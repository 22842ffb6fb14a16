// "Skip to the plan": the first tab stop on a page with a plan, so a keyboard user reaches the plan without
// walking through every control before it (WCAG 2.4.1). Hidden until it has the keyboard's focus; pressing it
// moves focus to the plan (the element with the given test id, made focusable by script only, tabindex −1,
// so it adds no tab stop of its own). Web only: native screen readers have their own ways to jump.
import { useState } from 'react';
import { Platform, Pressable, StyleSheet, Text } from 'react-native';
import { colours, fonts, radius, space } from '../constants/theme';

/** Moves the keyboard's focus to the element with this test id; false when there is none. */
export function focusByTestId(testId: string): boolean {
  if (typeof document === 'undefined') return false;
  const el = document.querySelector<HTMLElement>(`[data-testid="${testId}"]`);
  if (!el) return false;
  if (!el.hasAttribute('tabindex')) el.setAttribute('tabindex', '-1');
  el.focus();
  return document.activeElement === el;
}

export function SkipLink({ to = 'plan', label = 'Skip to the plan' }: { to?: string; label?: string }) {
  const [shown, setShown] = useState(false);
  if (Platform.OS !== 'web') return null;
  return (
    <Pressable
      role="link"
      onPress={() => focusByTestId(to)}
      // Enter (and Space) on the web: a link without an address is not activated by the keyboard on its own
      // (react-native-web passes onKeyDown to the element; React Native's types do not list it).
      {...{
        onKeyDown: (e: { nativeEvent: { key: string }; preventDefault: () => void }) => {
          if (e.nativeEvent.key !== 'Enter' && e.nativeEvent.key !== ' ') return;
          e.preventDefault();
          focusByTestId(to);
        },
      }}
      onFocus={() => setShown(true)}
      onBlur={() => setShown(false)}
      style={[s.link, shown ? s.shown : s.hidden]}
      testID="skip-link"
    >
      <Text style={s.text}>{label}</Text>
    </Pressable>
  );
}

const s = StyleSheet.create({
  link: { position: 'absolute', zIndex: 100, backgroundColor: colours.accent, borderRadius: radius.md, paddingHorizontal: space.lg, minHeight: 44, justifyContent: 'center' },
  shown: { top: space.sm, left: space.sm },
  // Off screen rather than display:none, so it stays in the tab order.
  hidden: { top: -200, left: space.sm, opacity: 0 },
  text: { color: colours.accentText, fontFamily: fonts.sansBold, fontSize: 16 },
});
