// Which scouts walk this field. The list of scout accounts comes from the page that uses the panel.
import { useState } from 'react';
import { Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField } from '../../../components/form-field.tsx';
import { EmptyState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import type { UserView as User } from '@shared/schemas/users.ts';
import { useAssignScout } from '../api/assign-scout.ts';
import { useUnassignScout } from '../api/unassign-scout.ts';

export function FieldScoutsPanel({ field, scouts }: { field: Field; scouts: User[] }) {
  const assign = useAssignScout();
  const unassign = useUnassignScout();
  const [choice, setChoice] = useState('');
  const assignedIds = new Set(field.scoutIds ?? []);
  const assigned = scouts.filter((s) => assignedIds.has(s.id));
  const available = scouts.filter((s) => !assignedIds.has(s.id) && s.active);
  const failure = assign.error ?? unassign.error;

  return (
    <Panel title="Scouts on this field">
      {assigned.length === 0 ? (
        <EmptyState title="No scout assigned">Assigned scouts see this field on their phone and can record walks on it.</EmptyState>
      ) : (
        <ul className="divide-y divide-straw-200">
          {assigned.map((scout) => (
            <li key={scout.id} className="flex items-center justify-between gap-2 py-2">
              <span>
                <span className="font-medium">{scout.name}</span> <span className="text-sm text-soil-600">{scout.email}</span>
              </span>
              <Button
                variant="quiet"
                size="sm"
                busy={unassign.isPending && unassign.variables?.userId === scout.id}
                onClick={() => unassign.mutate({ fieldId: field.id, userId: scout.id })}
                aria-label={`Remove ${scout.name} from this field`}
              >
                Remove
              </Button>
            </li>
          ))}
        </ul>
      )}
      <form
        className="mt-4 flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          if (choice) assign.mutate({ fieldId: field.id, userId: choice }, { onSuccess: () => setChoice('') });
        }}
      >
        <SelectField
          label="Assign a scout"
          value={choice}
          onChange={(e) => setChoice(e.target.value)}
          className="min-w-56 flex-1"
          hint={available.length === 0 ? 'Every active scout is already assigned; invite more from Users.' : undefined}
        >
          <option value="">Choose a scout…</option>
          {available.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </SelectField>
        <Button type="submit" variant="secondary" disabled={!choice} busy={assign.isPending} className={available.length === 0 ? 'mb-5' : ''}>
          Assign
        </Button>
      </form>
      {failure && (
        <div className="mt-3">
          <FormMessage>{errorMessage(failure)}</FormMessage>
        </div>
      )}
    </Panel>
  );
}
