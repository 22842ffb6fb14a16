import { zodResolver } from '@hookform/resolvers/zod';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FormField } from '../../components/FormField';
import { Button } from '../../components/ui';
import { signInBody } from '../../model/api';

type Values = z.infer<typeof signInBody>;

/** A sign-in-shaped form: the two fields bound to react-hook-form with the shared zod schema. */
function SignInForm({ onValid }: { onValid: (v: Values) => void }) {
  const { control, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(signInBody), defaultValues: { email: '', password: '' } });
  return (
    <>
      <FormField control={control} name="email" label="E-mail" error={formState.errors.email?.message} autoCapitalize="none" />
      <FormField control={control} name="password" label="Password" error={formState.errors.password?.message} secureTextEntry />
      <Button label="Sign in" onPress={handleSubmit(onValid)} />
    </>
  );
}

describe('FormField', () => {
  it('puts what is typed into the form value', async () => {
    const user = userEvent.setup();
    const onValid = vi.fn();
    render(<SignInForm onValid={onValid} />);

    await user.type(screen.getByLabelText('E-mail'), 'ada@example.com');
    await user.type(screen.getByLabelText('Password'), 'correct horse');
    expect(screen.getByLabelText('E-mail')).toHaveDisplayValue('ada@example.com');

    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(onValid).toHaveBeenCalledTimes(1));
    expect(onValid.mock.calls[0]![0]).toEqual({ email: 'ada@example.com', password: 'correct horse' });
  });

  it('shows the schema error beside the field and does not submit', async () => {
    const user = userEvent.setup();
    const onValid = vi.fn();
    render(<SignInForm onValid={onValid} />);

    await user.type(screen.getByLabelText('E-mail'), 'not an address');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('enter an e-mail address')).toBeInTheDocument();
    expect(screen.getByText('enter your password')).toBeInTheDocument();
    expect(screen.getAllByRole('alert')).toHaveLength(2);
    expect(onValid).not.toHaveBeenCalled();
  });

  it('shows an error given from outside (e.g. the server) as an alert', () => {
    function Taken() {
      const { control } = useForm<{ email: string }>({ defaultValues: { email: 'ada@example.com' } });
      return <FormField control={control} name="email" label="E-mail" error="that e-mail already has an account" />;
    }
    render(<Taken />);
    expect(screen.getByLabelText('E-mail')).toHaveDisplayValue('ada@example.com');
    expect(screen.getByRole('alert')).toHaveTextContent('that e-mail already has an account');
  });

  it('shows no alert while the field is fine', () => {
    function Fine() {
      const { control } = useForm<{ email: string }>({ defaultValues: { email: '' } });
      return <FormField control={control} name="email" label="E-mail" />;
    }
    render(<Fine />);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
