import { useState, type FormEvent } from 'react';
import { farmSchema } from '@shared/schemas/farms.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import type { FarmView as Farm, FarmContactView as FarmContact } from '@shared/schemas/farms.ts';
import { useCreateFarm } from '../api/create-farm.ts';
import { useUpdateFarm } from '../api/update-farm.ts';
import { ContactsEditor } from './contacts-editor.tsx';

/** Creates a farm, or edits one when `farm` is given. */
export function FarmForm({ farm, onSaved }: { farm?: Farm; onSaved?: (farm: Farm) => void }) {
  const create = useCreateFarm();
  const update = useUpdateFarm();
  const [name, setName] = useState(farm?.name ?? '');
  const [contacts, setContacts] = useState<FarmContact[]>(farm?.contacts.map(({ name, email }) => ({ name, email })) ?? []);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const failure = create.error ?? update.error;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setSaved(false);
    const checked = checkForm(farmSchema, { name, contacts });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    const options = {
      onSuccess: (result: Farm) => {
        setSaved(true);
        if (!farm) {
          setName('');
          setContacts([]);
        }
        onSaved?.(result);
      },
      onError: (error: Error) => setErrors(serverFieldErrors(error)),
    };
    if (farm) update.mutate({ id: farm.id, ...checked.value }, options);
    else create.mutate(checked.value, options);
  };

  return (
    <form onSubmit={submit} noValidate className="space-y-4">
      <TextField label="Farm name" name="farm-name" value={name} error={errors.name} onChange={(e) => setName(e.target.value)} className="max-w-md" />
      <ContactsEditor contacts={contacts} errors={errors} onChange={setContacts} />
      {failure && <FormMessage>{errorMessage(failure)}</FormMessage>}
      {saved && farm && <FormMessage tone="success">Farm saved.</FormMessage>}
      <Button type="submit" busy={create.isPending || update.isPending}>
        {farm ? 'Save farm' : 'Create farm'}
      </Button>
    </form>
  );
}
