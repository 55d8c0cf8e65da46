// Grower accounts linked to a farm: they may sign in and see its fields and notices, read-only.
import { useState } from 'react';
import { Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage, SelectField } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { FarmView as Farm } from '@shared/schemas/farms.ts';
import { useUsers } from '../api/get-users.ts';
import { useLinkGrower } from '../api/link-grower.ts';
import { useUnlinkGrower } from '../api/unlink-grower.ts';

export function FarmGrowersPanel({ farm }: { farm: Farm }) {
  const users = useUsers();
  const link = useLinkGrower();
  const unlink = useUnlinkGrower();
  const [choice, setChoice] = useState('');
  const linkedIds = new Set(farm.growerUserIds ?? []);
  const growers = (users.data ?? []).filter((u) => u.role === 'grower');
  const linked = growers.filter((g) => linkedIds.has(g.id));
  const available = growers.filter((g) => !linkedIds.has(g.id) && g.active);
  const failure = link.error ?? unlink.error;

  return (
    <Panel title="Grower accounts">
      {users.isPending ? (
        <LoadingState label="Loading accounts…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => users.refetch()} />
      ) : (
        <>
          {linked.length === 0 ? (
            <p className="text-sm text-soil-700">No grower account is linked; contacts still receive notices by e-mail.</p>
          ) : (
            <ul className="divide-y divide-straw-200">
              {linked.map((grower) => (
                <li key={grower.id} className="flex items-center justify-between gap-2 py-2">
                  <span>
                    <span className="font-medium">{grower.name}</span> <span className="text-sm text-soil-600">{grower.email}</span>
                  </span>
                  <Button variant="quiet" size="sm" onClick={() => unlink.mutate({ farmId: farm.id, userId: grower.id })} aria-label={`Unlink ${grower.name}`}>
                    Unlink
                  </Button>
                </li>
              ))}
            </ul>
          )}
          <form
            className="mt-4 flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (choice) link.mutate({ farmId: farm.id, userId: choice }, { onSuccess: () => setChoice('') });
            }}
          >
            <SelectField label="Link a grower account" value={choice} onChange={(e) => setChoice(e.target.value)} className="min-w-56 flex-1">
              <option value="">{available.length ? 'Choose a grower…' : 'No unlinked grower accounts'}</option>
              {available.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.name} ({g.email})
                </option>
              ))}
            </SelectField>
            <Button type="submit" variant="secondary" disabled={!choice} busy={link.isPending}>
              Link
            </Button>
          </form>
          {failure && (
            <div className="mt-3">
              <FormMessage>{errorMessage(failure)}</FormMessage>
            </div>
          )}
        </>
      )}
    </Panel>
  );
}
