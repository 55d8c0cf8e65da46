import { useState, type FormEvent } from 'react';
import { Link, useLocation, useNavigate } from 'react-router';
import { signInSchema } from '@shared/schemas/auth.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useSignIn } from '../api/sign-in.ts';
import { AuthCard } from './auth-card.tsx';

export function SignInPage() {
  const navigate = useNavigate();
  const location = useLocation();
  const signIn = useSignIn();
  const [values, setValues] = useState({ email: '', password: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const from = (location.state as { from?: string } | null)?.from ?? '/';

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(signInSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    signIn.mutate(checked.value, {
      onSuccess: () => navigate(from, { replace: true }),
      onError: (error) => setErrors(serverFieldErrors(error)),
    });
  };

  return (
    <AuthCard
      title="Sign in"
      intro="Scouting, pattern checks and zone notices for your farms."
      footer={
        <Link to="/forgot-password" className="font-medium text-field-700 underline-offset-2 hover:underline">
          Forgot your password?
        </Link>
      }
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          value={values.email}
          error={errors.email}
          onChange={(e) => setValues({ ...values, email: e.target.value })}
        />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="current-password"
          value={values.password}
          error={errors.password}
          onChange={(e) => setValues({ ...values, password: e.target.value })}
        />
        {signIn.isError && <FormMessage>{errorMessage(signIn.error)}</FormMessage>}
        <Button type="submit" size="lg" className="w-full" busy={signIn.isPending}>
          Sign in
        </Button>
      </form>
    </AuthCard>
  );
}
