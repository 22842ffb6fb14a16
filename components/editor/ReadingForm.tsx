// A light's real meter reading, typed and confirmed. The photographer fires this light alone, meters at the
// subject and types what the meter showed (f-number at an ISO, how far the meter was from the light, and for
// a continuous light the shutter); nothing changes on the plan until they confirm, and a kept reading can be
// changed or cleared. From then on the meter anchors this light's predictions to the measurement.
import { useId, useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { FieldProblem, NumberInput, Row } from './fields';
import { checkTyped, formatFNumber, parseFNumber, READING_RANGES, type MeterReading, type Range } from '../../model/fields';
import { formatPower, formatShutter, lengthText, parseLength, parseNumber, parseShutter, unitSuffix, type Units } from '../../model/units';

/** What a new reading starts from: the camera's ISO and shutter, the light's distance to the subject. */
export type ReadingStart = { iso: number; distanceM: number | null; shutterS: number };

type Key = 'aperture' | 'iso' | 'distanceM' | 'shutterS';
type Spec = { label: string; range: Range; parse: (t: string) => number | null; format: (v: number) => string; testID: string };

function specs(units: Units): Record<Key, Spec> {
  return {
    aperture: { label: 'The meter showed f/', range: READING_RANGES.aperture, parse: parseFNumber, format: formatFNumber, testID: 'reading-aperture' },
    iso: { label: 'At ISO', range: READING_RANGES.iso, parse: parseNumber, format: (v) => v.toFixed(0), testID: 'reading-iso' },
    distanceM: { label: `Meter's distance from the light (${unitSuffix(units)})`, range: READING_RANGES.distanceM, parse: (t) => parseLength(t, units), format: (v) => lengthText(v, units), testID: 'reading-distance' },
    shutterS: { label: 'At shutter (s)', range: READING_RANGES.shutterS, parse: parseShutter, format: formatShutter, testID: 'reading-shutter' },
  };
}

function describeReading(r: MeterReading, units: Units, powerNow: number): string {
  const parts = [`f/${formatFNumber(r.aperture)} at ISO ${r.iso.toFixed(0)}`, `${lengthText(r.distanceM, units).trim()} ${unitSuffix(units)} from the light`];
  if (r.shutterS !== null) parts.push(`at ${formatShutter(r.shutterS)} s`);
  parts.push(`at power ${formatPower(r.power ?? powerNow)}`);
  return parts.join(', ');
}

export function ReadingForm({
  label,
  value,
  units,
  needsShutter,
  powerNow,
  start,
  onSave,
  readOnly = false,
}: {
  label: string;
  value: MeterReading | null;
  units: Units;
  needsShutter: boolean;
  powerNow: number;
  /** Called when the form opens for a new reading. */
  start: () => ReadingStart;
  onSave: (v: MeterReading | null) => void;
  readOnly?: boolean;
}) {
  const [draft, setDraft] = useState<Record<Key, string> | null>(null);
  const [problems, setProblems] = useState<Partial<Record<Key, string>>>({});
  const sp = specs(units);
  const keys: Key[] = needsShutter ? ['aperture', 'iso', 'distanceM', 'shutterS'] : ['aperture', 'iso', 'distanceM'];

  const open = () => {
    const s = start();
    setProblems({});
    setDraft(
      value
        ? { aperture: sp.aperture.format(value.aperture), iso: sp.iso.format(value.iso), distanceM: sp.distanceM.format(value.distanceM), shutterS: sp.shutterS.format(value.shutterS ?? s.shutterS) }
        : // The f-number is what only the meter knows: it starts empty.
          { aperture: '', iso: sp.iso.format(s.iso), distanceM: s.distanceM !== null ? sp.distanceM.format(s.distanceM) : '', shutterS: sp.shutterS.format(s.shutterS) },
    );
  };
  const confirm = () => {
    if (!draft) return;
    const out: Partial<Record<Key, number>> = {};
    const found: Partial<Record<Key, string>> = {};
    for (const k of keys) {
      const r = checkTyped(draft[k], sp[k]);
      if (r.ok) out[k] = r.value;
      else found[k] = draft[k].trim() === '' ? `Needed. Accepted: ${sp[k].format(sp[k].range.min).trim()} to ${sp[k].format(sp[k].range.max).trim()}.` : r.message;
    }
    setProblems(found);
    if (Object.keys(found).length) return;
    onSave({ aperture: out.aperture!, iso: out.iso!, distanceM: out.distanceM!, shutterS: needsShutter ? out.shutterS! : null, power: value?.power ?? powerNow });
    setDraft(null);
  };

  return (
    <View style={s.box} testID="reading">
      <Text style={s.sub} role="heading" aria-level={3}>
        {label}
      </Text>
      {draft ? (
        <View role="form" aria-label="Your meter reading">
          <Text style={s.dim}>Fire this light alone, meter at the subject, and type what your meter showed. Nothing changes until you use the reading.</Text>
          {keys.map((k) => (
            <DraftField
              key={k}
              spec={sp[k]}
              text={draft[k]}
              problem={problems[k] ?? null}
              onChange={(t) => {
                setDraft({ ...draft, [k]: t });
                if (problems[k]) setProblems({ ...problems, [k]: undefined });
              }}
              onSubmit={confirm}
            />
          ))}
          <Text style={s.dim}>Kept with the light's power {value ? 'of the reading' : 'now'}: {formatPower(value?.power ?? powerNow)}.</Text>
          <View style={s.actions}>
            <Act label="Use this reading" onPress={confirm} strong testID="reading-confirm" />
            <Act label="Cancel" onPress={() => setDraft(null)} testID="reading-cancel" />
          </View>
        </View>
      ) : value ? (
        <View>
          <Text style={s.text} testID="reading-kept">
            The meter is anchored to your reading: {describeReading(value, units, powerNow)}.
          </Text>
          {readOnly ? null : (
            <View style={s.actions}>
              <Act label="Change the reading" onPress={open} testID="reading-change" />
              <Act label="Clear the reading" onPress={() => onSave(null)} testID="reading-clear" />
            </View>
          )}
        </View>
      ) : (
        <View>
          <Text style={s.dim}>No reading: the meter predicts this light from its rating and modifier.</Text>
          {readOnly ? null : (
            <View style={s.actions}>
              <Act label="Enter a real reading" onPress={open} testID="reading-open" />
            </View>
          )}
        </View>
      )}
    </View>
  );
}

function DraftField({ spec, text, problem, onChange, onSubmit }: { spec: Spec; text: string; problem: string | null; onChange: (t: string) => void; onSubmit: () => void }) {
  const messageId = useId().replace(/[^A-Za-z0-9_-]/g, '');
  return (
    <View>
      <Row label={spec.label}>
        <NumberInput label={spec.label} text={text} problemId={problem !== null ? messageId : null} onChangeText={onChange} onSubmit={onSubmit} testID={spec.testID} />
      </Row>
      {problem !== null ? <FieldProblem id={messageId} text={problem} testID={`${spec.testID}-problem`} /> : null}
    </View>
  );
}

function Act({ label, onPress, strong, testID }: { label: string; onPress: () => void; strong?: boolean; testID?: string }) {
  return (
    <Pressable role="button" onPress={onPress} testID={testID} style={({ pressed }) => [s.action, strong && s.strong, pressed && { opacity: 0.8 }]}>
      <Text style={[s.actionText, strong && { color: colours.accentText }]}>{label}</Text>
    </Pressable>
  );
}

const s = StyleSheet.create({
  box: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.md, marginTop: space.sm, gap: space.sm },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 14, lineHeight: 20, marginBottom: space.sm },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, lineHeight: 19, marginBottom: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  action: { minHeight: 44, paddingHorizontal: space.md, borderRadius: 8, borderWidth: 1, borderColor: colours.line, justifyContent: 'center' },
  strong: { backgroundColor: colours.accent, borderColor: colours.accent },
  actionText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 13 },
});
