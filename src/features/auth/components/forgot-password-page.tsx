import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { forgotPasswordSchema } from '@shared/schemas/auth.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useRequestPasswordReset } from '../api/forgot-password.ts';
import { AuthCard } from './auth-card.tsx';

export function ForgotPasswordPage() {
  const reset = useRequestPasswordReset();
  const [email, setEmail] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(forgotPasswordSchema, { email });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    reset.mutate(checked.value, { onError: (error) => setErrors(serverFieldErrors(error)) });
  };

  return (
    <AuthCard
      title="Reset your password"
      intro="We will e-mail a link to set a new password."
      footer={
        <Link to="/sign-in" className="font-medium text-field-700 hover:underline">
          Back to sign-in
        </Link>
      }
    >
      {reset.isSuccess ? (
        <FormMessage tone="success">{reset.data.message}</FormMessage>
      ) : (
        <form onSubmit={submit} noValidate className="space-y-4">
          <TextField
            label="E-mail address"
            name="email"
            type="email"
            autoComplete="username"
            value={email}
            error={errors.email}
            onChange={(e) => setEmail(e.target.value)}
          />
          {reset.isError && <FormMessage>{errorMessage(reset.error)}</FormMessage>}
          <Button type="submit" size="lg" className="w-full" busy={reset.isPending}>
            Send the link
          </Button>
        </form>
      )}
    </AuthCard>
  );
}
