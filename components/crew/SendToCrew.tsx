// "Send to crew": addresses and a note; the server e-mails a new read-only link and the crew sheet PDF.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type Control } from 'react-hook-form';
import { StyleSheet, Switch, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { ApiRequestError } from '../../hooks/api';
import { useSendToCrew } from '../../hooks/shares';
import { sendToCrewForm, type SendToCrewResult } from '../../model/api';
import { FormField } from '../FormField';
import { Body, Button, ErrorText } from '../ui';

type Form = { to: string; message: string };

export function SendToCrew({ setupId }: { setupId: string }) {
  const send = useSendToCrew(setupId);
  const [attachPdf, setAttachPdf] = useState(true);
  const [done, setDone] = useState<SendToCrewResult | null>(null);
  const { control: typed, handleSubmit, formState, setError, reset } = useForm<Form, unknown, { to: string[]; message: string }>({
    resolver: zodResolver(sendToCrewForm),
    defaultValues: { to: '', message: '' },
  });
  // The fields edit the typed text (addresses as one line); only submit sees the parsed list.
  const control = typed as unknown as Control<Form>;

  const submit = handleSubmit((v) =>
    send.mutate(
      { to: v.to, message: v.message.trim() || undefined, attachPdf },
      {
        onSuccess: (r) => {
          setDone(r);
          reset();
        },
        onError: (e) => {
          if (e instanceof ApiRequestError) for (const [k, m] of Object.entries(e.fields)) setError(k.startsWith('to') ? 'to' : 'message', { message: m });
        },
      },
    ),
  );

  return (
    <View style={s.wrap}>
      <Text style={s.sub}>Send to crew</Text>
      <FormField control={control} name="to" label="E-mail addresses" error={formState.errors.to?.message} placeholder="kit@example.test, sam@example.test" autoCapitalize="none" keyboardType="email-address" />
      <FormField control={control} name="message" label="Note (optional)" error={formState.errors.message?.message} placeholder="Call time, parking, what to bring" multiline />
      <View style={s.toggle}>
        <Switch value={attachPdf} onValueChange={setAttachPdf} accessibilityLabel="Attach the crew sheet PDF" />
        <Text style={s.toggleText}>Attach the crew sheet PDF</Text>
      </View>
      <Button label="Send" onPress={() => void submit()} busy={send.isPending} testID="send-to-crew" />
      {send.error && !(send.error instanceof ApiRequestError && Object.keys(send.error.fields).length) ? <ErrorText>{send.error.message}</ErrorText> : null}
      {done ? (
        <Body dim style={s.small} testID="sent-note">
          Sent to {done.sent.join(', ')}. They can open the plan without an account{done.attached ? '; the PDF is attached' : ''}.
        </Body>
      ) : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { gap: space.sm },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  small: { fontSize: 13, lineHeight: 18 },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  toggleText: { color: colours.text, fontFamily: fonts.sans, fontSize: 14 },
});
