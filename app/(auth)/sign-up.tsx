import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AuthFrame } from '../../components/AuthFrame';
import { FormField } from '../../components/FormField';
import { Body, Button, ErrorText } from '../../components/ui';
import { authClient } from '../../hooks/auth';
import { useReturnPath } from '../../hooks/returnPath';
import { signUpBody } from '../../model/api';

type Values = z.infer<typeof signUpBody>;

export default function SignUp() {
  const next = useReturnPath();
  const [failure, setFailure] = useState<string | null>(null);
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(signUpBody), defaultValues: { name: '', email: '', password: '' } });
  const submit = handleSubmit(async (v) => {
    setFailure(null);
    const { error } = await authClient.signUp.email({ name: v.name, email: v.email, password: v.password });
    if (error) return setFailure(error.message ?? 'Could not create the account.');
    // The signed-out layout sends the visitor on (to ?next=) as soon as the session arrives.
  });
  return (
    <AuthFrame title="Create your account">
      <FormField control={control} name="name" label="Name" error={formState.errors.name?.message} autoComplete="name" testID="name" />
      <FormField control={control} name="email" label="E-mail" error={formState.errors.email?.message} autoComplete="email" keyboardType="email-address" autoCapitalize="none" testID="email" />
      <FormField control={control} name="password" label="Password (8 characters or more)" error={formState.errors.password?.message} secureTextEntry autoComplete="new-password" onSubmitEditing={submit} testID="password" />
      {failure ? <ErrorText>{failure}</ErrorText> : null}
      <Button label="Create account" onPress={submit} busy={formState.isSubmitting} testID="submit" />
      <Body dim style={{ marginTop: 20, textAlign: 'center' }}>
        Already have one?{' '}
        <Link href={next === '/setups' ? '/sign-in' : { pathname: '/sign-in', params: { next } }} style={{ color: '#f0b24a' }}>
          Sign in
        </Link>
      </Body>
    </AuthFrame>
  );
}
