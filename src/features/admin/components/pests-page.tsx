// The pest library with its action thresholds; each threshold is shown with its source.
import { useState } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { PestView as Pest } from '@shared/schemas/pests.ts';
import { usePests } from '../../../lib/api/get-pests.ts';
import { useUpdatePest } from '../api/update-pest.ts';
import { PestForm } from './pest-form.tsx';
import { ThresholdText } from './threshold-text.tsx';

const column = createColumnHelper<Pest>();

export function PestsPage() {
  const pests = usePests(true);
  const update = useUpdatePest();
  const [editing, setEditing] = useState<Pest | 'new' | null>(null);

  const columns = [
    column.accessor('name', {
      header: 'Pest',
      cell: (info) => (
        <span className={info.row.original.active ? 'font-medium' : 'font-medium text-soil-500 line-through decoration-soil-400'}>{info.getValue()}</span>
      ),
    }),
    column.accessor('kind', { header: 'Kind', cell: (info) => <span className="capitalize">{info.getValue()}</span> }),
    column.accessor('crops', {
      header: 'Crops',
      enableSorting: false,
      cell: (info) => (info.getValue().length ? info.getValue().join(', ') : <span className="text-soil-600">No crop named</span>),
    }),
    column.accessor('actionThreshold', {
      header: 'Action threshold and source',
      enableSorting: false,
      cell: (info) => <ThresholdText pest={info.row.original} />,
    }),
    column.accessor('active', {
      header: 'In use',
      cell: (info) => (info.getValue() ? <span className="text-field-800">Active</span> : <span className="text-soil-600">Deactivated</span>),
    }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => {
        const pest = info.row.original;
        return (
          <div className="flex justify-end gap-1">
            {!pest.thresholdConfirmed && (
              <Button
                variant="quiet"
                size="sm"
                onClick={() => update.mutate({ id: pest.id, thresholdConfirmed: true })}
                aria-label={`Confirm the threshold of ${pest.name}`}
              >
                Confirm
              </Button>
            )}
            <Button variant="quiet" size="sm" onClick={() => setEditing(pest)} aria-label={`Edit ${pest.name}`}>
              Edit
            </Button>
            <Button
              variant="quiet"
              size="sm"
              className={pest.active ? 'text-patch-700' : ''}
              onClick={() => update.mutate({ id: pest.id, active: !pest.active })}
              aria-label={`${pest.active ? 'Deactivate' : 'Reactivate'} ${pest.name}`}
            >
              {pest.active ? 'Deactivate' : 'Reactivate'}
            </Button>
          </div>
        );
      },
    }),
  ];

  return (
    <PageFrame title="Pest library" eyebrow="Admin" wide actions={editing === null && <Button onClick={() => setEditing('new')}>Add a pest</Button>}>
      <p className="-mt-3 max-w-3xl text-sm text-soil-700">
        Thresholds differ by region, crop stage, price and product. Edit them to match the guidance your advisers follow, and always say where a figure comes
        from. Confirm a threshold once you have checked its value against the publication it names; until then every screen marks it as needing confirmation,
        and editing its value or source asks for confirmation again.
      </p>
      {editing !== null && (
        <Panel title={editing === 'new' ? 'New pest' : `Edit ${editing.name}`}>
          <PestForm key={editing === 'new' ? 'new' : editing.id} pest={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </Panel>
      )}
      {update.isError && <FormMessage>{errorMessage(update.error)}</FormMessage>}
      {pests.isPending ? (
        <LoadingState label="Loading the pest library…" />
      ) : pests.isError ? (
        <ErrorState error={pests.error} onRetry={() => pests.refetch()} />
      ) : pests.data.length === 0 ? (
        <EmptyState title="The pest library is empty">
          Add the pests your advisers scout for, each with its action threshold and the source of that threshold.
        </EmptyState>
      ) : (
        <TableFrame caption="Pest library" columns={columns} rows={pests.data} rowId={(p) => p.id} />
      )}
    </PageFrame>
  );
}
