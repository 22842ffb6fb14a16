// Set a new password from the e-mailed link (the link arrives here with ?token=, or ?error= when it is spent).
import { Link, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AuthFrame } from '../../components/AuthFrame';
import { FormField } from '../../components/FormField';
import { Body, Button, ErrorText } from '../../components/ui';
import { loadAuthClient, useWarmAuth } from '../../hooks/auth';
import { lazyResolver, useWarmForms } from '../../hooks/lazyResolver';
import type { resetPasswordBody } from '../../model/forms';

type Values = z.infer<typeof resetPasswordBody>;

export default function ResetPassword() {
  const { token, error: linkError } = useLocalSearchParams<{ token?: string; error?: string }>();
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  useWarmForms();
  useWarmAuth();
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: lazyResolver((s) => s.resetPasswordBody), defaultValues: { password: '' } });
  const submit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await (await loadAuthClient()).resetPassword({ newPassword: v.password, token: token ?? '' });
    if (error) return setFailure('This link has been used or has run out. Ask for a new one.');
    setDone(true);
  });
  const usable = token && !linkError;
  return (
    <AuthFrame title="Set a new password">
      {done ? (
        <Body testID="reset-done">Your password is changed. Sign in with the new one.</Body>
      ) : usable ? (
        <>
          <FormField control={control} name="password" label="New password (8 characters or more)" error={formState.errors.password?.message} secureTextEntry autoComplete="new-password" onSubmitEditing={submit} />
          {failure ? <ErrorText>{failure}</ErrorText> : null}
          <Button label="Set the password" onPress={submit} busy={formState.isSubmitting} />
        </>
      ) : (
        <ErrorText>This link has been used or has run out. Ask for a new one.</ErrorText>
      )}
      <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
        <Link href={done ? '/sign-in' : '/forgot-password'} style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
          {done ? 'Sign in' : 'Ask for a new link'}
        </Link>
      </Body>
    </AuthFrame>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
