import { Link, router, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AuthFrame } from '../../components/AuthFrame';
import { FormField } from '../../components/FormField';
import { Body, Button, ErrorText } from '../../components/ui';
import { loadAuthClient, useSessionChanged, useWarmAuth } from '../../hooks/auth';
import { useHydrated } from '../../hooks/hydration';
import { useReturnPath } from '../../hooks/returnPath';
import { lazyResolver, useWarmForms } from '../../hooks/lazyResolver';
import type { signUpBody } from '../../model/forms';

type Values = z.infer<typeof signUpBody>;

export default function SignUp() {
  const next = useReturnPath();
  const [failure, setFailure] = useState<string | null>(null);
  // Kept in the address too: the session is read again after a sign-up, and the signed-out layout may remount
  // this screen while it is.
  // (Read once the page has hydrated: it is rendered at build time, without an address.)
  const { sent } = useLocalSearchParams<{ sent?: string }>();
  const hydrated = useHydrated();
  const [sentState, setSentTo] = useState<string | null>(null);
  const sentTo = sentState ?? (hydrated && typeof sent === 'string' && sent ? sent : null);
  useWarmForms();
  useWarmAuth();
  const sessionChanged = useSessionChanged();
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: lazyResolver((s) => s.signUpBody), defaultValues: { name: '', email: '', password: '' } });
  const submit = handleSubmit(async (v) => {
    setFailure(null);
    // The confirmation link signs the person in and opens ?next= (the signed-out layout sends them on).
    const { error } = await (await loadAuthClient()).signUp.email({ name: v.name, email: v.email, password: v.password, callbackURL: next });
    if (error) return setFailure(error.message ?? 'Could not create the account.');
    // The same answer whether or not the address already had an account: the mail says which.
    setSentTo(v.email.trim());
    router.setParams({ sent: v.email.trim() });
    void sessionChanged();
  });
  if (sentTo) {
    const local = typeof window !== 'undefined' && /^(localhost|127\.0\.0\.1|\[::1\])$/.test(window.location.hostname);
    return (
      <AuthFrame title="Check your inbox">
        <Body testID="check-inbox">
          We sent a link to {sentTo}. Open it to confirm the address and sign in. Until the address is confirmed you can draw setups, but
          not join a studio or a class by invitation or send mail to others.
        </Body>
        {local ? (
          <Body dim style={{ marginTop: 12 }}>
            Running Falloff on this computer? The mail is in the dev inbox at /dev/inbox.
          </Body>
        ) : null}
        <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
          <Link href={next === '/setups' ? '/sign-in' : { pathname: '/sign-in', params: { next } }} style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
            Sign in
          </Link>
        </Body>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title="Create your account">
      <FormField control={control} name="name" label="Name" error={formState.errors.name?.message} autoComplete="name" testID="name" />
      <FormField control={control} name="email" label="E-mail" error={formState.errors.email?.message} autoComplete="email" keyboardType="email-address" autoCapitalize="none" testID="email" />
      <FormField control={control} name="password" label="Password (8 characters or more)" error={formState.errors.password?.message} secureTextEntry autoComplete="new-password" onSubmitEditing={submit} testID="password" />
      {failure ? <ErrorText>{failure}</ErrorText> : null}
      <Button label="Create account" onPress={submit} busy={formState.isSubmitting} testID="submit" />
      <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
        Already have one?{' '}
        <Link href={next === '/setups' ? '/sign-in' : { pathname: '/sign-in', params: { next } }} style={{ color: '#f0b24a', textDecorationLine: 'underline' }}>
          Sign in
        </Link>
      </Body>
    </AuthFrame>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../../components/RouteError';
