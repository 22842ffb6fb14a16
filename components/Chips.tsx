// Selectable pills: filters (a tag, a studio), and a segmented choice (one of a few).
import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../constants/theme';

export function Chip({ label, selected, onPress, testID, hint }: { label: string; selected: boolean; onPress: () => void; testID?: string; hint?: string }) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityHint={hint}
      accessibilityState={{ selected }}
      aria-pressed={selected}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [s.chip, selected && s.chipOn, pressed && { opacity: 0.8 }]}
    >
      <Text style={[s.chipText, selected && s.chipTextOn]} numberOfLines={1}>
        {label}
      </Text>
    </Pressable>
  );
}

/** A horizontally scrolling row of chips (phones), wrapping is not needed. */
export function ChipRow({ children, label }: { children: ReactNode; label: string }) {
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={s.row} accessibilityLabel={label}>
      {children}
    </ScrollView>
  );
}

export function Segmented<T extends string>({ options, value, onChange, label }: { options: { value: T; label: string }[]; value: T; onChange: (v: T) => void; label: string }) {
  return (
    <View style={s.segmented} accessibilityRole="tablist" accessibilityLabel={label}>
      {options.map((o) => {
        const on = o.value === value;
        return (
          <Pressable
            key={o.value}
            accessibilityRole="tab"
            accessibilityLabel={o.label}
            accessibilityState={{ selected: on }}
            // react-native-web reads aria-* props, not accessibilityState: the web announces the chosen tab by this.
            aria-selected={on}
            onPress={() => onChange(o.value)}
            style={[s.segment, on && s.segmentOn]}
          >
            <Text style={[s.segmentText, on && s.segmentTextOn]}>{o.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const s = StyleSheet.create({
  row: { gap: space.sm, paddingVertical: 2 },
  chip: { borderWidth: 1, borderColor: colours.line, borderRadius: 999, paddingHorizontal: space.md, minHeight: 34, justifyContent: 'center', backgroundColor: colours.graphite },
  chipOn: { backgroundColor: colours.accent, borderColor: colours.accent },
  chipText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, maxWidth: 220 },
  chipTextOn: { color: colours.accentText },
  segmented: { flexDirection: 'row', backgroundColor: colours.graphite, borderRadius: radius.md, borderWidth: 1, borderColor: colours.line, padding: 3, alignSelf: 'flex-start' },
  segment: { paddingHorizontal: space.md, minHeight: 36, justifyContent: 'center', borderRadius: radius.sm },
  segmentOn: { backgroundColor: colours.panelRaised },
  segmentText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 14 },
  segmentTextOn: { color: colours.text },
});
