import { useState, type FormEvent } from 'react';
import { inviteUserSchema } from '@shared/schemas/users.ts';
import { roleLabels, roles } from '@shared/schemas/roles.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField, TextField } from '../../../components/form-field.tsx';
import { Panel } from '../../../components/page-frame.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useInviteUser } from '../api/invite-user.ts';

const blank = { name: '', email: '', role: 'scout' };

export function InviteUserForm() {
  const invite = useInviteUser();
  const [values, setValues] = useState(blank);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(inviteUserSchema, values);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    setSentTo(null);
    invite.mutate(checked.value, {
      onSuccess: () => {
        setSentTo(checked.value.email);
        setValues(blank);
      },
      onError: (error) => setErrors(serverFieldErrors(error)),
    });
  };

  return (
    <Panel title="Invite someone">
      <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-[1fr_1fr_10rem_auto] sm:items-start">
        <TextField
          label="Name"
          name="name"
          autoComplete="off"
          value={values.name}
          error={errors.name}
          onChange={(e) => setValues({ ...values, name: e.target.value })}
        />
        <TextField
          label="E-mail address"
          name="email"
          type="email"
          autoComplete="off"
          value={values.email}
          error={errors.email}
          onChange={(e) => setValues({ ...values, email: e.target.value })}
        />
        <SelectField label="Role" name="role" value={values.role} error={errors.role} onChange={(e) => setValues({ ...values, role: e.target.value })}>
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" busy={invite.isPending} className="sm:mt-6">
          Send invitation
        </Button>
      </form>
      <div className="mt-3 space-y-2">
        {sentTo && <FormMessage tone="success">Invitation sent to {sentTo}. The link in it works once and expires.</FormMessage>}
        {invite.isError && !Object.keys(serverFieldErrors(invite.error)).length && <FormMessage>{errorMessage(invite.error)}</FormMessage>}
      </div>
    </Panel>
  );
}
