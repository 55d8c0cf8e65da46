// The farm's grower contacts: the names and addresses that receive zone notices.
import { Button } from '../../../components/button.tsx';
import { TextField } from '../../../components/form-field.tsx';
import type { FieldErrors } from '../../../lib/form-errors.ts';
import type { FarmContactView as FarmContact } from '@shared/schemas/farms.ts';

export function ContactsEditor({ contacts, errors, onChange }: { contacts: FarmContact[]; errors: FieldErrors; onChange: (contacts: FarmContact[]) => void }) {
  const edit = (index: number, change: Partial<FarmContact>) => onChange(contacts.map((c, i) => (i === index ? { ...c, ...change } : c)));
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-semibold text-soil-800">Grower contacts</legend>
      <p className="text-xs text-soil-600">Zone notices for this farm go to these addresses.</p>
      {contacts.length === 0 && <p className="text-sm text-soil-700">No contact yet.</p>}
      {contacts.map((contact, index) => (
        <div key={index} className="grid gap-2 rounded-md bg-straw-50 p-3 ring-1 ring-straw-200 sm:grid-cols-[1fr_1fr_auto] sm:items-start">
          <TextField
            label={`Contact ${index + 1} name`}
            value={contact.name}
            error={errors[`contacts.${index}.name`]}
            onChange={(e) => edit(index, { name: e.target.value })}
          />
          <TextField
            label={`Contact ${index + 1} e-mail`}
            type="email"
            value={contact.email}
            error={errors[`contacts.${index}.email`]}
            onChange={(e) => edit(index, { email: e.target.value })}
          />
          <Button
            variant="quiet"
            size="sm"
            className="text-patch-700 sm:mt-7"
            onClick={() => onChange(contacts.filter((_, i) => i !== index))}
            aria-label={`Remove contact ${index + 1}`}
          >
            Remove
          </Button>
        </div>
      ))}
      {errors.contacts && <p className="text-sm font-medium text-patch-700">{errors.contacts}</p>}
      <Button variant="secondary" size="sm" onClick={() => onChange([...contacts, { name: '', email: '' }])}>
        Add a contact
      </Button>
    </fieldset>
  );
}
