// The meter check of an assignment: editing its targets (instructors) and showing a result, criterion by
// criterion with the measured value (the same evaluateCheck result on the client and from the server).
import { Pressable, Text, TextInput, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { checkMeasures, checkSchema, describeTarget, type Check, type CheckMeasure, type CheckResult } from '../../model/classes';
import { Chip } from '../Chips';
import { ErrorText } from '../ui';
import { Pill, s } from './parts';

export type CriterionDraft = { measure: CheckMeasure; min: string; max: string };
/** Drafts to a check: numbers typed with a comma or a minus sign of either kind are read as numbers. */
export function parseDrafts(rows: CriterionDraft[]): { check: Check | null; errors: Record<string, string> } {
  if (!rows.length) return { check: null, errors: {} };
  const num = (t: string) => {
    const v = t.trim().replace(',', '.').replace('−', '-');
    return v === '' ? null : Number(v);
  };
  const r = checkSchema.safeParse({ criteria: rows.map((k) => ({ measure: k.measure, min: num(k.min), max: num(k.max) })) });
  if (r.success) return { check: r.data, errors: {} };
  return { check: null, errors: Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message])) };
}

const hints: Record<CheckMeasure, string> = {
  subject: 'stops vs the camera, e.g. −0.3 to 0.3',
  background: 'stops vs the subject, e.g. highest −2',
  keyFill: 'x of x:1, e.g. 2 to 4',
  lights: 'lights switched on, e.g. highest 1',
  ambient: 'stops vs the camera, e.g. highest −3',
};

export function CheckEditor({ rows, onChange, errors }: { rows: CriterionDraft[]; onChange: (rows: CriterionDraft[]) => void; errors: Record<string, string> }) {
  const set = (k: number, patch: Partial<CriterionDraft>) => onChange(rows.map((r, i) => (i === k ? { ...r, ...patch } : r)));
  return (
    <View style={{ gap: space.md }}>
      {rows.map((r, k) => (
        <View key={k} style={[s.item, { gap: space.sm }]} testID="criterion">
          <View style={s.row} role="radiogroup" aria-label={`Target ${k + 1} measures`}>
            {(Object.keys(checkMeasures) as CheckMeasure[]).map((m) => (
              <Chip key={m} label={checkMeasures[m].label} selected={r.measure === m} onPress={() => set(k, { measure: m })} />
            ))}
          </View>
          <View style={s.row}>
            <Bound label={`Target ${k + 1} lowest`} value={r.min} onChange={(min) => set(k, { min })} error={errors[`criteria.${k}.min`]} />
            <Bound label={`Target ${k + 1} highest`} value={r.max} onChange={(max) => set(k, { max })} error={errors[`criteria.${k}.max`]} />
            <Pressable accessibilityRole="button" accessibilityLabel={`Remove target ${k + 1}`} onPress={() => onChange(rows.filter((_r, i) => i !== k))}>
              <Text style={s.link}>Remove</Text>
            </Pressable>
          </View>
          <Text style={s.dim}>{hints[r.measure]}</Text>
        </View>
      ))}
      {errors.criteria ? <ErrorText>{errors.criteria}</ErrorText> : null}
      <Pressable accessibilityRole="button" accessibilityLabel="Add a target" onPress={() => onChange([...rows, { measure: rows.length ? 'subject' : 'background', min: '', max: '' }])}>
        <Text style={s.link}>+ Add a target the meter can check</Text>
      </Pressable>
    </View>
  );
}

function Bound({ label, value, onChange, error }: { label: string; value: string; onChange: (v: string) => void; error?: string }) {
  return (
    <View style={{ gap: 2, minWidth: 120, flex: 1 }}>
      <Text style={s.label}>{label.replace(/^Target \d+ /, '')}</Text>
      <TextInput accessibilityLabel={label} value={value} onChangeText={onChange} keyboardType="numbers-and-punctuation" placeholder="none" placeholderTextColor={colours.textFaint} style={[s.input, error ? { borderColor: colours.danger } : null]} />
      {error ? <ErrorText>{error}</ErrorText> : null}
    </View>
  );
}

/** The targets in words (before any plan is checked). */
export function CheckTargets({ check }: { check: Check }) {
  return (
    <View style={{ gap: 4 }}>
      {check.criteria.map((c, k) => (
        <Text key={k} style={s.text}>
          • {checkMeasures[c.measure].label}: {describeTarget(c)}
        </Text>
      ))}
    </View>
  );
}

export function CheckResultView({ result, title, testID }: { result: CheckResult; title: string; testID?: string }) {
  const met = result.criteria.filter((c) => c.pass).length;
  return (
    <View style={{ gap: space.sm }} testID={testID}>
      <View style={s.row}>
        <Text style={s.heading}>{title}</Text>
        <Pill label={result.pass ? 'Passes' : 'Not yet'} tone={result.pass ? 'ok' : 'bad'} testID={testID ? `${testID}-verdict` : undefined} />
        <Text style={s.dim}>
          {met} of {result.criteria.length} targets met
        </Text>
      </View>
      {result.missing.length ? <Text style={s.dim}>The plan needs {result.missing.join(' and ')} for a reading.</Text> : null}
      {result.criteria.map((c, k) => (
        <View key={k} style={[s.row, { alignItems: 'flex-start' }]} accessibilityLabel={`${c.label}: ${c.pass ? 'met' : 'not met'}, measured ${c.measuredText}, target ${c.target}`}>
          <Text style={{ color: c.pass ? colours.ok : colours.danger, fontFamily: fonts.sansBold, fontSize: 15, width: 20 }}>{c.pass ? '✓' : '✗'}</Text>
          <View style={{ flex: 1 }}>
            <Text style={s.text}>
              {c.label}: <Text style={{ fontFamily: fonts.monoMedium }}>{c.measuredText}</Text>
            </Text>
            <Text style={s.dim}>
              target {c.target}
              {c.note ? ` · ${c.note}` : ''}
            </Text>
          </View>
        </View>
      ))}
    </View>
  );
}
