// Setting an assignment on a lesson: the task in words, the reference setup (students may start from a
// copy of it), and optionally targets the meter checks. Students are e-mailed when it is set.
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { Text, TextInput, View } from 'react-native';
import { colours, space } from '../../constants/theme';
import { ApiRequestError } from '../../hooks/api';
import { useCreateAssignment } from '../../hooks/classes';
import type { LessonDetail } from '../../model/api';
import { Chip } from '../Chips';
import { Button, Card, ErrorText } from '../ui';
import { CheckEditor, parseDrafts, type CriterionDraft } from './Check';
import { Heading, errorText, s } from './parts';
import { DUE_HINT, parseDueDate } from '../../model/dueDate';

/** The due date, typed as a day (and a time) in the reader's time zone; blank for none. */
export function DueField({ value, onChange, error, onSubmit }: { value: string; onChange: (t: string) => void; error?: string; onSubmit?: () => void }) {
  return (
    <View style={{ gap: 4 }}>
      <Text style={s.label}>Due (optional)</Text>
      <TextInput
        accessibilityLabel="Due date"
        aria-invalid={!!error}
        value={value}
        onChangeText={onChange}
        onSubmitEditing={onSubmit}
        placeholder="2027-03-01 18:00"
        placeholderTextColor={colours.textFaint}
        style={[s.input, error ? { borderColor: colours.danger } : null]}
        testID="due-date"
      />
      {error ? <ErrorText>{error}</ErrorText> : <Text style={s.dim}>Type {DUE_HINT}; your own time zone.</Text>}
    </View>
  );
}

export function AssignmentForm({ lesson }: { lesson: LessonDetail }) {
  const router = useRouter();
  const create = useCreateAssignment({ id: lesson.id, classId: lesson.classId });
  const [title, setTitle] = useState('');
  const [brief, setBrief] = useState('');
  const [referenceId, setReferenceId] = useState<string | null>(lesson.setups[0]?.id ?? null);
  const [rows, setRows] = useState<CriterionDraft[]>([]);
  const [due, setDue] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});

  const submit = async () => {
    const { check, errors: checkErrors } = parseDrafts(rows);
    const dueAt = parseDueDate(due);
    const local: Record<string, string> = { ...checkErrors, ...(title.trim() ? {} : { title: 'give the assignment a title' }), ...(dueAt.ok ? {} : { dueAt: dueAt.message }) };
    setErrors(local);
    if (Object.keys(local).length || !dueAt.ok) return;
    try {
      const a = await create.mutateAsync({ title: title.trim(), brief, referenceId, check, dueAt: dueAt.value });
      router.push(`/assignments/${a.id}`);
    } catch (e) {
      if (e instanceof ApiRequestError && Object.keys(e.fields).length) setErrors(Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [k.replace(/^check\./, ''), v])));
    }
  };

  return (
    <Card style={{ gap: space.md }}>
      <Heading>Set an assignment</Heading>
      <View style={{ gap: 4 }}>
        <Text style={s.label}>Task</Text>
        <TextInput accessibilityLabel="Assignment title" value={title} onChangeText={setTitle} placeholder="One light and a reflector, dark background" placeholderTextColor={colours.textFaint} style={[s.input, errors.title ? { borderColor: colours.danger } : null]} />
        {errors.title ? <ErrorText>{errors.title}</ErrorText> : null}
      </View>
      <View style={{ gap: 4 }}>
        <Text style={s.label}>Brief</Text>
        <TextInput
          accessibilityLabel="Assignment brief"
          value={brief}
          onChangeText={setBrief}
          multiline
          placeholder="Reproduce this look with one light and a reflector; keep the background at least 2 stops under the subject."
          placeholderTextColor={colours.textFaint}
          style={[s.input, { minHeight: 80, textAlignVertical: 'top' }]}
        />
      </View>
      <DueField value={due} onChange={setDue} error={errors.dueAt} />
      <View style={{ gap: 4 }} role="radiogroup" aria-label="Reference look">
        <Text style={s.label}>Reference look (students may start from a copy)</Text>
        <View style={s.row}>
          {lesson.setups.map((e) => (
            <Chip key={e.id} label={e.title} selected={referenceId === e.id} onPress={() => setReferenceId(e.id)} />
          ))}
          <Chip label="None" selected={referenceId === null} onPress={() => setReferenceId(null)} />
        </View>
      </View>
      <View style={{ gap: 4 }}>
        <Text style={s.label}>Targets the meter checks (optional)</Text>
        <CheckEditor rows={rows} onChange={setRows} errors={errors} />
      </View>
      {create.error && !(create.error instanceof ApiRequestError && Object.keys(create.error.fields).length) ? <ErrorText>{errorText(create.error)}</ErrorText> : null}
      <Button label="Set the assignment" onPress={submit} busy={create.isPending} testID="set-assignment" />
      <Text style={s.dim}>The class’s students get an e-mail when you set it.</Text>
    </Card>
  );
}
