// Forgotten password: the account's address gets a link that sets a new one.
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AuthFrame } from '../../components/AuthFrame';
import { FormField } from '../../components/FormField';
import { Body, Button, ErrorText } from '../../components/ui';
import { loadAuthClient, useWarmAuth } from '../../hooks/auth';
import { lazyResolver, useWarmForms } from '../../hooks/lazyResolver';
import type { forgotPasswordBody } from '../../model/forms';

type Values = z.infer<typeof forgotPasswordBody>;

export default function ForgotPassword() {
  const [sent, setSent] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  useWarmForms();
  useWarmAuth();
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: lazyResolver((s) => s.forgotPasswordBody), defaultValues: { email: '' } });
  const submit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await (await loadAuthClient()).requestPasswordReset({ email: v.email, redirectTo: '/reset-password' });
    if (error) return setFailure(error.message ?? 'The link could not be sent. Try again in a moment.');
    setSent(v.email);
  });
  return (
    <AuthFrame title="Forgotten password">
      {sent ? (
        <Body testID="reset-sent">If {sent} has an account, a link to set a new password is on its way. It works once, for an hour.</Body>
      ) : (
        <>
          <Body dim style={{ marginBottom: 16 }}>
            Enter the address you sign in with; we will e-mail a link that sets a new password.
          </Body>
          <FormField control={control} name="email" label="E-mail" error={formState.errors.email?.message} autoComplete="email" keyboardType="email-address" autoCapitalize="none" onSubmitEditing={submit} />
          {failure ? <ErrorText>{failure}</ErrorText> : null}
          <Button label="Send the link" onPress={submit} busy={formState.isSubmitting} />
        </>
      )}
      <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
        <Link href="/sign-in" style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
          Back to sign in
        </Link>
      </Body>
    </AuthFrame>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
