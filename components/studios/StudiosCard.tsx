// The Account screen's studios: each opens its members; "New studio" makes a shared one you own.
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { z } from 'zod';
import { colours, fonts, space } from '../../constants/theme';
import { useCreateStudio, useStudios } from '../../hooks/studios';
import { createStudioBody } from '../../model/forms';
import { Dialog, DialogActions } from '../Dialog';
import { FormField } from '../FormField';
import { showServerError } from '../library/SetupDialogs';
import { Body, Button, Card, ErrorText } from '../ui';

const roleWords = { owner: 'Owner', editor: 'Editor', crew: 'Crew' } as const;

export function StudiosCard() {
  const router = useRouter();
  const studios = useStudios();
  const [creating, setCreating] = useState(false);
  return (
    <Card>
      <View style={s.head}>
        <Text style={s.heading}>Studios</Text>
        <Button label="New studio" kind="quiet" onPress={() => setCreating(true)} testID="new-studio" />
      </View>
      <Body dim style={{ marginBottom: space.sm }}>A studio shares its setups with its members: owners and editors change them, crew open them and comment.</Body>
      {studios.isError ? <ErrorText>Could not load your studios: {studios.error.message}</ErrorText> : null}
      {(studios.data ?? []).map((st) => (
        <Pressable
          key={st.id}
          accessibilityRole="link"
          onPress={() => router.push(`/studios/${st.id}`)}
          style={({ pressed }) => [s.row, pressed && { opacity: 0.7 }]}
        >
          <View style={{ flex: 1 }}>
            <Text style={s.name}>{st.name}</Text>
            <Text style={s.meta}>
              {st.personal ? 'personal · ' : ''}
              {st.memberCount} {st.memberCount === 1 ? 'member' : 'members'}
            </Text>
          </View>
          <Text style={s.role}>{roleWords[st.role]}</Text>
          <Text style={s.chevron}>›</Text>
        </Pressable>
      ))}
      <NewStudioDialog
        visible={creating}
        onClose={() => setCreating(false)}
        onMade={(id) => {
          setCreating(false);
          router.push(`/studios/${id}`);
        }}
      />
    </Card>
  );
}

type Values = z.input<typeof createStudioBody>;

function NewStudioDialog({ visible, onClose, onMade }: { visible: boolean; onClose: () => void; onMade: (id: string) => void }) {
  const create = useCreateStudio();
  const { control, handleSubmit, formState, reset, setError } = useForm<Values>({ resolver: zodResolver(createStudioBody), defaultValues: { name: '' } });
  const submit = handleSubmit(async (v) => {
    try {
      const made = await create.mutateAsync(v);
      reset({ name: '' });
      onMade(made.id);
    } catch (err) {
      const other = showServerError(err, setError, ['name']);
      if (other) setError('root', { message: other });
    }
  });
  return (
    <Dialog visible={visible} title="New studio" onClose={onClose}>
      <Body dim style={{ marginBottom: space.md }}>You will be its owner; invite your team from its page.</Body>
      <FormField control={control} name="name" label="Name" placeholder="e.g. Harbour Road team" error={formState.errors.name?.message} onSubmitEditing={submit} autoFocus testID="studio-name" />
      {formState.errors.root ? <ErrorText>{formState.errors.root.message}</ErrorText> : null}
      <DialogActions>
        <Button label="Cancel" kind="quiet" onPress={onClose} />
        <Button label="Make the studio" onPress={submit} busy={formState.isSubmitting} testID="make-studio" />
      </DialogActions>
    </Dialog>
  );
}

const s = StyleSheet.create({
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', marginBottom: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.md, borderTopWidth: 1, borderTopColor: colours.line, minHeight: 48 },
  name: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  meta: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13 },
  role: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 14 },
  chevron: { color: colours.textFaint, fontSize: 22 },
});
