// Small pieces the class screens share: a page frame, a back link, headings, a status pill, a text box that
// saves when it loses focus, and the server's error in words.
import { Link, useRouter, type Href } from 'expo-router';
import { useEffect, useState, type ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, TextInput, View, type ViewStyle } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { usePageTitle } from '../../hooks/pageTitle';

export function Page({ children, wide = false, testID }: { children: ReactNode; wide?: boolean; testID?: string }) {
  return (
    <ScrollView style={s.root} contentContainerStyle={[s.page, wide && { maxWidth: 1280 }]} testID={testID} keyboardShouldPersistTaps="handled">
      {children}
    </ScrollView>
  );
}

export function Back({ href, label }: { href: Href; label: string }) {
  return (
    <Link href={href} style={s.back} accessibilityRole="link">
      ← {label}
    </Link>
  );
}

/** A card-like row that opens another screen, named by its visible words (what a person sees is what they can say). */
export function CardLink({ href, children, testID }: { href: Href; children: ReactNode; testID?: string }) {
  const router = useRouter();
  return (
    <Pressable
      accessibilityRole="link"
      onPress={() => router.push(href)}
      testID={testID}
      style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [s.card, (pressed || hovered) && { backgroundColor: colours.panelRaised }]}
    >
      {children}
    </Pressable>
  );
}

export function Heading({ children, right }: { children: ReactNode; right?: ReactNode }) {
  return (
    <View style={s.headingRow}>
      <Text style={s.heading} role="heading" aria-level={2}>
        {children}
      </Text>
      {right}
    </View>
  );
}

export function Pill({ label, tone = 'dim', testID }: { label: string; tone?: 'dim' | 'ok' | 'bad' | 'accent'; testID?: string }) {
  const colour = { dim: colours.textDim, ok: colours.ok, bad: colours.danger, accent: colours.accent }[tone];
  return (
    <Text style={[s.pill, { color: colour, borderColor: colour }]} testID={testID}>
      {label}
    </Text>
  );
}

/** A labelled text box that reports its text when it loses focus (and on Enter for one line). */
export function SavingText({
  label,
  value,
  onSave,
  multiline = false,
  placeholder,
  style,
  testID,
}: {
  label: string;
  value: string;
  onSave: (text: string) => void;
  multiline?: boolean;
  placeholder?: string;
  style?: ViewStyle;
  testID?: string;
}) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  const commit = () => text !== value && onSave(text);
  return (
    <View style={[{ gap: 4 }, style]}>
      <Text style={s.label}>{label}</Text>
      <TextInput
        accessibilityLabel={label}
        value={text}
        onChangeText={setText}
        onBlur={commit}
        onSubmitEditing={multiline ? undefined : commit}
        multiline={multiline}
        placeholder={placeholder}
        placeholderTextColor={colours.textFaint}
        style={[s.input, multiline && { minHeight: 72, textAlignVertical: 'top' }]}
        testID={testID}
      />
    </View>
  );
}

export { errorText } from '../errorText';

export function NotFound({ what, back }: { what: string; back: ReactNode }) {
  usePageTitle(`${what} not found`);
  return (
    <Page>
      {back}
      <Text style={s.title} role="heading" aria-level={1}>
        {what} not found
      </Text>
      <Text style={s.dim}>It may have been removed, or it belongs to a class you are not in.</Text>
    </Page>
  );
}

export const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  page: { padding: space.lg, gap: space.md, maxWidth: 860, width: '100%', alignSelf: 'center', paddingBottom: 64 },
  // One line 44 px high: a finger's target (the words alone were 18 px).
  back: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 14, lineHeight: 44, alignSelf: 'flex-start' },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 24 },
  headingRow: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17 },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, letterSpacing: 0.3 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 14, lineHeight: 20 },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, lineHeight: 22 },
  mono: { color: colours.text, fontFamily: fonts.mono, fontSize: 14 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  item: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm, gap: 4 },
  pill: { fontFamily: fonts.sansMedium, fontSize: 12, borderWidth: 1, borderRadius: 999, paddingHorizontal: 8, paddingVertical: 2, overflow: 'hidden' },
  input: {
    color: colours.text,
    fontFamily: fonts.sans,
    fontSize: 15,
    backgroundColor: colours.graphite,
    borderWidth: 1,
    borderColor: colours.line,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    minHeight: 44,
  },
  link: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 15 },
  card: { backgroundColor: colours.panel, borderRadius: radius.lg, padding: space.lg, borderWidth: 1, borderColor: colours.line, gap: 4 },
});
