// Inspector controls with units: a number that commits on Enter or blur and has thumb-sized steppers, a
// choice row, a switch and a text field. Each is labelled for screen readers.
import { memo, useEffect, useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, Switch, Text, TextInput, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';

export function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <View style={s.row}>
      <Text style={s.label}>{label}</Text>
      <View style={s.control}>{children}</View>
    </View>
  );
}

/**
 * A number field. `format` shows the value, `parse` reads what was typed (null = not valid, the field
 * reverts); steppers call `onStep(±1)`.
 */
export const NumberField = memo(function NumberField({
  label,
  value,
  format,
  parse,
  onCommit,
  onStep,
  testID,
}: {
  label: string;
  value: number;
  format: (v: number) => string;
  parse: (text: string) => number | null;
  onCommit: (v: number) => void;
  onStep?: (dir: -1 | 1) => void;
  testID?: string;
}) {
  const [text, setText] = useState(format(value));
  const [focused, setFocused] = useState(false);
  const [bad, setBad] = useState(false);
  useEffect(() => {
    if (!focused) setText(format(value));
  }, [value, focused, format]);
  const commit = () => {
    if (text === format(value)) return setBad(false);
    const v = parse(text);
    if (v === null || !Number.isFinite(v)) {
      setBad(true);
      setText(format(value));
      return;
    }
    setBad(false);
    if (v !== value) onCommit(v);
  };
  return (
    <Row label={label}>
      {onStep ? <Step label={`Less ${label.toLowerCase()}`} text="−" onPress={() => onStep(-1)} /> : null}
      <TextInput
        accessibilityLabel={label}
        value={text}
        onChangeText={setText}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          commit();
        }}
        onSubmitEditing={commit}
        selectTextOnFocus
        style={[s.input, bad && { borderColor: colours.danger }]}
        testID={testID}
      />
      {onStep ? <Step label={`More ${label.toLowerCase()}`} text="+" onPress={() => onStep(1)} /> : null}
    </Row>
  );
}, sameValues);

/** Fields re-render when what they show changes, not when their callbacks are new closures (a drag makes new
 *  ones every frame). So a field's callback may be older than the item: callbacks must use only the field's
 *  own value or read the current item at call time (the inspector's function patches do). */
function sameValues(a: Record<string, unknown>, b: Record<string, unknown>): boolean {
  for (const k of Object.keys(b)) {
    if (typeof b[k] === 'function') continue;
    if (k === 'options' ? JSON.stringify(a[k]) !== JSON.stringify(b[k]) : a[k] !== b[k]) return false;
  }
  return true;
}

function Step({ label, text, onPress }: { label: string; text: string; onPress: () => void }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} style={({ pressed }) => [s.step, pressed && { backgroundColor: colours.line }]}>
      <Text style={s.stepText}>{text}</Text>
    </Pressable>
  );
}

/** Lists longer than this show only the chosen option until opened (a light's gels and modifiers). */
const COLLAPSE_OVER = 8;

function ChoiceFieldView<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: { id: T; label: string; swatch?: string }[]; onChange: (v: T) => void }) {
  const [open, setOpen] = useState(false);
  const collapsed = options.length > COLLAPSE_OVER && !open;
  const current = options.find((o) => o.id === value);
  if (collapsed) {
    return (
      <View style={{ marginBottom: space.md }}>
        <Text style={[s.label, { marginBottom: space.xs }]}>{label}</Text>
        <Pressable accessibilityRole="button" accessibilityLabel={`${label}: ${current?.label ?? value}. Change`} onPress={() => setOpen(true)} style={[s.chip, s.chipOn, { alignSelf: 'flex-start' }]}>
          {current?.swatch ? <View style={[s.swatch, { backgroundColor: current.swatch }]} /> : null}
          <Text style={[s.chipText, { color: colours.accentText }]}>{current?.label ?? value} ▾</Text>
        </Pressable>
      </View>
    );
  }
  return (
    <View style={{ marginBottom: space.md }}>
      <Text style={[s.label, { marginBottom: space.xs }]}>{label}</Text>
      <View style={s.chips} accessibilityRole="radiogroup" accessibilityLabel={label}>
        {options.map((o) => {
          const on = o.id === value;
          return (
            <Pressable
              key={o.id}
              accessibilityRole="radio"
              accessibilityState={{ checked: on }}
              accessibilityLabel={o.label}
              onPress={() => {
                onChange(o.id);
                setOpen(false);
              }}
              style={[s.chip, on && s.chipOn]}
            >
              {o.swatch ? <View style={[s.swatch, { backgroundColor: o.swatch }]} /> : null}
              <Text style={[s.chipText, on && { color: colours.accentText }]}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

export const ChoiceField = memo(ChoiceFieldView, sameValues) as typeof ChoiceFieldView;

export function SwitchField({ label, value, onChange }: { label: string; value: boolean; onChange: (v: boolean) => void }) {
  return (
    <Row label={label}>
      <Switch accessibilityLabel={label} value={value} onValueChange={onChange} trackColor={{ true: colours.accent, false: colours.line }} />
    </Row>
  );
}

export function TextField({ label, value, onCommit, multiline }: { label: string; value: string; onCommit: (v: string) => void; multiline?: boolean }) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  return (
    <View style={{ marginBottom: space.md }}>
      <Text style={[s.label, { marginBottom: space.xs }]}>{label}</Text>
      <TextInput
        accessibilityLabel={label}
        value={text}
        onChangeText={setText}
        onBlur={() => text !== value && onCommit(text)}
        onSubmitEditing={() => !multiline && text !== value && onCommit(text)}
        multiline={multiline}
        style={[s.input, s.wide, multiline && { minHeight: 80, textAlignVertical: 'top' }]}
      />
    </View>
  );
}

const s = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', marginBottom: space.sm, gap: space.sm },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, flexShrink: 1 },
  control: { flexDirection: 'row', alignItems: 'center', gap: 6 },
  input: {
    color: colours.text,
    fontFamily: fonts.mono,
    fontSize: 15,
    minWidth: 92,
    maxWidth: 130,
    textAlign: 'center',
    backgroundColor: colours.graphite,
    borderWidth: 1,
    borderColor: colours.line,
    borderRadius: radius.sm,
    paddingHorizontal: space.sm,
    minHeight: 40,
  },
  wide: { maxWidth: '100%', width: '100%', textAlign: 'left', fontFamily: fonts.sans, paddingVertical: space.sm },
  step: { width: 40, height: 40, borderRadius: radius.sm, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center' },
  stepText: { color: colours.text, fontSize: 20, fontFamily: fonts.sansMedium },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: 6 },
  chip: { flexDirection: 'row', alignItems: 'center', gap: 6, paddingHorizontal: 10, minHeight: 34, borderRadius: 999, borderWidth: 1, borderColor: colours.line },
  chipOn: { backgroundColor: colours.accent, borderColor: colours.accent },
  chipText: { color: colours.text, fontFamily: fonts.sans, fontSize: 13 },
  swatch: { width: 12, height: 12, borderRadius: 6, borderWidth: 1, borderColor: '#0006' },
});
