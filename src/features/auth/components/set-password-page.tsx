import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router';
import { setPasswordSchema } from '@shared/schemas/auth.ts';
import { Button, ButtonLink } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useSetPassword } from '../api/set-password.ts';
import { AuthCard } from './auth-card.tsx';

/** Reached from the invitation and reset e-mails: /set-password?token=… */
export function SetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const setPassword = useSetPassword();
  const [values, setValues] = useState({ password: '', repeat: '' });
  const [errors, setErrors] = useState<FieldErrors>({});

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(setPasswordSchema, { token, password: values.password });
    const found = checked.ok ? {} : checked.errors;
    if (values.repeat !== values.password) found.repeat = 'The two passwords differ; type the same one twice.';
    if (!checked.ok || found.repeat) return setErrors(found);
    setErrors({});
    setPassword.mutate(checked.value, { onError: (error) => setErrors(serverFieldErrors(error)) });
  };

  if (setPassword.isSuccess) {
    return (
      <AuthCard title="Password set">
        <FormMessage tone="success">{setPassword.data.message}</FormMessage>
        <ButtonLink to="/sign-in" size="lg" className="mt-4 w-full">
          Go to sign-in
        </ButtonLink>
      </AuthCard>
    );
  }

  return (
    <AuthCard
      title="Choose a password"
      intro="At least 12 characters; a short sentence is easy to remember."
      footer={
        <Link to="/sign-in" className="font-medium text-field-700 hover:underline">
          Back to sign-in
        </Link>
      }
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        {errors.token && <FormMessage>{errors.token}</FormMessage>}
        <TextField
          label="New password"
          name="password"
          type="password"
          autoComplete="new-password"
          value={values.password}
          error={errors.password}
          onChange={(e) => setValues({ ...values, password: e.target.value })}
        />
        <TextField
          label="Same password again"
          name="repeat"
          type="password"
          autoComplete="new-password"
          value={values.repeat}
          error={errors.repeat}
          onChange={(e) => setValues({ ...values, repeat: e.target.value })}
        />
        {setPassword.isError && <FormMessage>{errorMessage(setPassword.error)}</FormMessage>}
        <Button type="submit" size="lg" className="w-full" busy={setPassword.isPending}>
          Set password
        </Button>
      </form>
    </AuthCard>
  );
}
