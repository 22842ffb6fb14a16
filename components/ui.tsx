// Small layout primitives in Falloff's look. Screens compose these.
import type { ReactNode } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, Text, View, type TextProps, type ViewStyle } from 'react-native';
import { colours, fonts, radius, space } from '../constants/theme';
import { usePageTitle } from '../hooks/pageTitle';

/**
 * The page's one top-level heading (h1). It also titles the page after what it shows: its text, or `page`
 * when the heading is not plain text (or says it differently).
 */
export function Title({ children, page }: { children: ReactNode; page?: string }) {
  usePageTitle(page ?? (typeof children === 'string' ? children.trim() : null));
  return (
    <Text role="heading" aria-level={1} style={s.title}>
      {children}
    </Text>
  );
}

/** A section's heading (h2) under the page's Title. */
export function Body(props: TextProps & { dim?: boolean }) {
  return <Text {...props} style={[s.body, props.dim && { color: colours.textDim }, props.style]} />;
}

export function Button({
  label,
  onPress,
  kind = 'primary',
  busy = false,
  disabled = false,
  testID,
}: {
  label: string;
  onPress: () => void;
  kind?: 'primary' | 'quiet';
  busy?: boolean;
  disabled?: boolean;
  testID?: string;
}) {
  const off = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled: off, busy }}
      // react-native-web reads aria-* props, not accessibilityState: without these the web build never says busy.
      aria-busy={busy}
      aria-disabled={off}
      disabled={off}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [s.button, kind === 'quiet' && s.quiet, pressed && { opacity: 0.8 }, off && { opacity: 0.55 }]}
    >
      {busy ? <ActivityIndicator color={kind === 'primary' ? colours.accentText : colours.text} /> : null}
      <Text style={[s.buttonText, kind === 'quiet' && { color: colours.text }]}>{label}</Text>
    </Pressable>
  );
}

export function Card({ children, style }: { children: ReactNode; style?: ViewStyle }) {
  return <View style={[s.card, style]}>{children}</View>;
}

export function ErrorText({ children }: { children: ReactNode }) {
  return (
    <Text accessibilityRole="alert" style={s.error}>
      {children}
    </Text>
  );
}

const s = StyleSheet.create({
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 26, marginBottom: space.md },
  body: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, lineHeight: 22 },
  button: {
    flexDirection: 'row',
    gap: space.sm,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: colours.accent,
    borderRadius: radius.md,
    paddingVertical: space.md,
    paddingHorizontal: space.lg,
    minHeight: 48,
  },
  quiet: { backgroundColor: 'transparent', borderWidth: 1, borderColor: colours.line },
  buttonText: { color: colours.accentText, fontFamily: fonts.sansBold, fontSize: 16 },
  card: { backgroundColor: colours.panel, borderRadius: radius.lg, padding: space.lg, borderWidth: 1, borderColor: colours.line },
  error: { color: colours.danger, fontFamily: fonts.sans, fontSize: 14, marginTop: space.xs },
});
