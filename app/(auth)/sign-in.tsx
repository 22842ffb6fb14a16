import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AuthFrame } from '../../components/AuthFrame';
import { FormField } from '../../components/FormField';
import { Body, Button, ErrorText } from '../../components/ui';
import { loadAuthClient, useSessionChanged, useWarmAuth } from '../../hooks/auth';
import { useReturnPath } from '../../hooks/returnPath';
import { lazyResolver, useWarmForms } from '../../hooks/lazyResolver';
import type { signInBody } from '../../model/forms';

type Values = z.infer<typeof signInBody>;

export default function SignIn() {
  const next = useReturnPath();
  const [failure, setFailure] = useState<string | null>(null);
  useWarmForms();
  useWarmAuth();
  const sessionChanged = useSessionChanged();
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: lazyResolver((s) => s.signInBody), defaultValues: { email: '', password: '' } });
  const submit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await (await loadAuthClient()).signIn.email({ email: v.email, password: v.password });
    if (error) return setFailure(error.status === 401 ? 'That e-mail and password do not match an account.' : (error.message ?? 'Sign-in failed.'));
    // The signed-out layout sends the visitor on (to ?next=) as soon as the session, read again now, arrives.
    await sessionChanged();
  });
  return (
    <AuthFrame title="Sign in">
      <FormField control={control} name="email" label="E-mail" error={formState.errors.email?.message} autoComplete="email" keyboardType="email-address" autoCapitalize="none" testID="email" />
      <FormField control={control} name="password" label="Password" error={formState.errors.password?.message} secureTextEntry autoComplete="current-password" onSubmitEditing={submit} testID="password" />
      {failure ? <ErrorText>{failure}</ErrorText> : null}
      <Button label="Sign in" onPress={submit} busy={formState.isSubmitting} testID="submit" />
      <Body dim style={{ marginTop: 14, textAlign: 'center' }}>
        <Link href="/forgot-password" style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
          Forgotten your password?
        </Link>
      </Body>
      <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
        New here?{' '}
        <Link href={next === '/setups' ? '/sign-up' : { pathname: '/sign-up', params: { next } }} style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
          Create an account
        </Link>
      </Body>
    </AuthFrame>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
