// Inspector controls with units: a number that commits on Enter or blur and has thumb-sized steppers, a
// choice row, a switch and a text field. Each is labelled for screen readers.
import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, Text, TextInput, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { checkTyped, type Range } from '../../model/fields';

export function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <View style={s.row}>
      <Text style={s.label}>{label}</Text>
      <View style={s.control}>{children}</View>
    </View>
  );
}

/**
 * Commits a field's unsent text when the field goes away while it is being edited (the selection moved on,
 * the sheet closed). It calls the field's latest `commit`, which is bound to the item the field was showing,
 * so typed text never lands on the item shown next.
 */
function useCommitOnUnmount(commit: () => void, dirty: boolean) {
  const latest = useRef({ commit, dirty });
  latest.current = { commit, dirty };
  useEffect(
    () => () => {
      if (latest.current.dirty) latest.current.commit();
    },
    [],
  );
}

/**
 * A number field on the phone's number pad. `format` shows the value, `parse` reads what was typed; a value
 * that does not read, or falls outside `range`, stays in the field with a message under it saying what the
 * field accepts (never a silent revert); steppers call `onStep(±1)`.
 *
 * Fields are not memoised: they render with the callbacks of the item they show, every time. (A comparator
 * that skipped renders when only the callbacks changed let a field keep the previous item's callbacks
 * whenever two items showed the same value, so an edit landed on the wrong item.)
 */
export function NumberField({
  label,
  value,
  format,
  parse,
  range,
  blankOk,
  onCommit,
  onStep,
  testID,
}: {
  label: string;
  value: number;
  format: (v: number) => string;
  parse: (text: string) => number | null;
  /** Accepted values, inclusive, in the stored unit. */
  range: Range;
  /** An empty field is "not set" (−1), not an error. */
  blankOk?: boolean;
  onCommit: (v: number) => void;
  onStep?: (dir: -1 | 1) => void;
  testID?: string;
}) {
  const formatted = format(value);
  const [text, setText] = useState(formatted);
  const [focused, setFocused] = useState(false);
  const focusedRef = useRef(false);
  focusedRef.current = focused;
  const [problem, setProblem] = useState<string | null>(null);
  const messageId = useId().replace(/[^A-Za-z0-9_-]/g, '');
  // A new value from elsewhere (a stepper, undo, a drag, other units) replaces the text unless the person is
  // typing; refused text stays until it is corrected or the value changes.
  useEffect(() => {
    if (focusedRef.current) return;
    setText(formatted);
    setProblem(null);
  }, [formatted]);
  const commit = () => {
    if (text === format(value)) return setProblem(null);
    const r = checkTyped(text, { range, parse, format, ...(blankOk ? { blankOk } : {}) });
    if (!r.ok) return setProblem(r.message);
    setProblem(null);
    if (r.value !== value) onCommit(r.value);
    else setText(format(value));
  };
  useCommitOnUnmount(commit, focused && text !== format(value));
  return (
    <View style={s.field}>
      <Row label={label}>
        {onStep ? (
          <Step
            label={`Less ${label.toLowerCase()}`}
            text="−"
            onPress={() => {
              setProblem(null);
              onStep(-1);
            }}
          />
        ) : null}
        <NumberInput
          label={label}
          text={text}
          problemId={problem !== null ? messageId : null}
          onChangeText={(t) => {
            setText(t);
            if (problem !== null) setProblem(null);
          }}
          onFocus={() => setFocused(true)}
          onBlur={() => {
            setFocused(false);
            commit();
          }}
          onSubmit={commit}
          testID={testID}
        />
        {onStep ? (
          <Step
            label={`More ${label.toLowerCase()}`}
            text="+"
            onPress={() => {
              setProblem(null);
              onStep(1);
            }}
          />
        ) : null}
      </Row>
      {problem !== null ? <FieldProblem id={messageId} text={problem} testID={testID ? `${testID}-problem` : undefined} /> : null}
    </View>
  );
}

/**
 * The number input itself, on the phone's number pad: digits and a decimal point. Fractions read from a bare
 * denominator ("200" is 1/200 s, "8" is 1/8 power) and imperial lengths from decimal feet, so nothing needs
 * the letters. `problemId` names the message under the field while the text is refused.
 */
export function NumberInput({
  label,
  text,
  problemId,
  onChangeText,
  onFocus,
  onBlur,
  onSubmit,
  testID,
}: {
  label: string;
  text: string;
  problemId: string | null;
  onChangeText: (t: string) => void;
  onFocus?: () => void;
  onBlur?: () => void;
  onSubmit: () => void;
  testID?: string;
}) {
  return (
    <TextInput
      accessibilityLabel={label}
      aria-invalid={problemId !== null}
      aria-describedby={problemId ?? undefined}
      inputMode="decimal"
      keyboardType="decimal-pad"
      enterKeyHint="done"
      value={text}
      onChangeText={onChangeText}
      onFocus={onFocus}
      onBlur={onBlur}
      onSubmitEditing={onSubmit}
      selectTextOnFocus
      style={[s.input, problemId !== null && { borderColor: colours.danger }]}
      testID={testID}
    />
  );
}

/** The message under a refused field: what it accepts. */
export function FieldProblem({ id, text, testID }: { id: string; text: string; testID?: string }) {
  return (
    <Text nativeID={id} accessibilityLiveRegion="polite" role="alert" style={s.problem} testID={testID}>
      {text}
    </Text>
  );
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

export function ChoiceField<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: { id: T; label: string; swatch?: string }[]; onChange: (v: T) => void }) {
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
              // Said outright when false too: a radio without aria-checked does not say it is not chosen.
              aria-checked={on}
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

/** An on/off setting: the whole row (its words and the track) is one switch, at least 44 px high, so a finger
 *  can take it anywhere along the row; the track and thumb are drawn, not a control of their own. */
export function SwitchField({ label, value, onChange }: { label: string; value: boolean; onChange: (v: boolean) => void }) {
  return (
    <Pressable role="switch" accessibilityRole="switch" aria-checked={value} accessibilityState={{ checked: value }} accessibilityLabel={label} onPress={() => onChange(!value)} style={[s.row, s.switchRow]}>
      <Text style={s.label}>{label}</Text>
      <View aria-hidden pointerEvents="none" style={[s.track, value && s.trackOn]}>
        <View style={[s.thumb, value && s.thumbOn]} />
      </View>
    </Pressable>
  );
}

export function TextField({ label, value, onCommit, multiline }: { label: string; value: string; onCommit: (v: string) => void; multiline?: boolean }) {
  const [text, setText] = useState(value);
  const [focused, setFocused] = useState(false);
  useEffect(() => setText(value), [value]);
  useCommitOnUnmount(() => onCommit(text), focused && text !== value);
  return (
    <View style={{ marginBottom: space.md }}>
      <Text style={[s.label, { marginBottom: space.xs }]}>{label}</Text>
      <TextInput
        accessibilityLabel={label}
        value={text}
        onChangeText={setText}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          if (text !== value) onCommit(text);
        }}
        onSubmitEditing={() => !multiline && text !== value && onCommit(text)}
        multiline={multiline}
        style={[s.input, s.wide, multiline && { minHeight: 80, textAlignVertical: 'top' }]}
      />
    </View>
  );
}

const s = StyleSheet.create({
  field: {},
  problem: { color: colours.danger, fontFamily: fonts.sans, fontSize: 13, marginTop: -4, marginBottom: space.sm, textAlign: 'right' },
  row: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', marginBottom: space.sm, gap: space.sm },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, flexShrink: 1 },
  control: { flexDirection: 'row', alignItems: 'center', gap: 6 },
  switchRow: { minHeight: 44 },
  track: { width: 40, height: 22, borderRadius: 11, backgroundColor: colours.line, padding: 2, justifyContent: 'center' },
  trackOn: { backgroundColor: colours.accent },
  thumb: { width: 18, height: 18, borderRadius: 9, backgroundColor: colours.text },
  thumbOn: { alignSelf: 'flex-end', backgroundColor: colours.accentText },
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
    minHeight: 44,
  },
  wide: { maxWidth: '100%', width: '100%', textAlign: 'left', fontFamily: fonts.sans, paddingVertical: space.sm },
  step: { width: 44, height: 44, borderRadius: radius.sm, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center' },
  stepText: { color: colours.text, fontSize: 20, fontFamily: fonts.sansMedium },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: 6 },
  chip: { flexDirection: 'row', alignItems: 'center', gap: 6, paddingHorizontal: 10, minHeight: 44, borderRadius: 999, borderWidth: 1, borderColor: colours.line },
  chipOn: { backgroundColor: colours.accent, borderColor: colours.accent },
  chipText: { color: colours.text, fontFamily: fonts.sans, fontSize: 13 },
  swatch: { width: 12, height: 12, borderRadius: 6, borderWidth: 1, borderColor: '#0006' },
});
