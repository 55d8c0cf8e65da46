// The admin's list of one farm's fields, with edit and a confirmed delete.
import { useState } from 'react';
import { Link } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { Panel } from '../../../components/page-frame.tsx';
import { Button, ButtonLink } from '../../../components/button.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { ConfirmDialog } from '../../../components/confirm-dialog.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { useFields } from '../../../lib/api/get-fields.ts';
import { useDeleteField } from '../api/delete-field.ts';

const column = createColumnHelper<Field>();

export function FarmFieldsPanel({ farmId }: { farmId: string }) {
  const fields = useFields(farmId);
  const remove = useDeleteField();
  const [doomed, setDoomed] = useState<Field | null>(null);

  const columns = [
    column.accessor('name', {
      header: 'Field',
      cell: (info) => (
        <Link to={`/fields/${info.row.original.id}`} className="font-medium text-field-700 hover:underline">
          {info.getValue()}
        </Link>
      ),
    }),
    column.accessor('crop', { header: 'Crop' }),
    column.accessor('season', { header: 'Season' }),
    column.accessor('areaM2', { header: 'Area', cell: (info) => <AreaText m2={info.getValue()} className="whitespace-nowrap" /> }),
    column.accessor((f) => f.scoutIds?.length ?? 0, { id: 'scouts', header: 'Scouts' }),
    column.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => (
        <div className="flex justify-end gap-1">
          <ButtonLink to={`/admin/fields/${info.row.original.id}/edit`} variant="quiet" size="sm" aria-label={`Edit ${info.row.original.name}`}>
            Edit
          </ButtonLink>
          <Button
            variant="quiet"
            size="sm"
            className="text-patch-700"
            aria-label={`Delete ${info.row.original.name}`}
            onClick={() => setDoomed(info.row.original)}
          >
            Delete
          </Button>
        </div>
      ),
    }),
  ];

  return (
    <Panel title="Fields" actions={<ButtonLink to={`/admin/farms/${farmId}/fields/new`}>Add a field</ButtonLink>}>
      {fields.isPending ? (
        <LoadingState label="Loading fields…" />
      ) : fields.isError ? (
        <ErrorState error={fields.error} onRetry={() => fields.refetch()} />
      ) : fields.data.length === 0 ? (
        <EmptyState title="This farm has no fields yet">Add a field with its boundary from a GeoJSON or KML file, or draw it on the map.</EmptyState>
      ) : (
        <TableFrame caption="Fields of this farm" columns={columns} rows={fields.data} rowId={(f) => f.id} />
      )}
      {remove.isError && (
        <div className="mt-3">
          <FormMessage>{errorMessage(remove.error)}</FormMessage>
        </div>
      )}
      <ConfirmDialog
        open={doomed !== null}
        title={`Delete ${doomed?.name ?? 'this field'}?`}
        confirmLabel="Delete field"
        busy={remove.isPending}
        onCancel={() => setDoomed(null)}
        onConfirm={() => doomed && remove.mutate(doomed.id, { onSettled: () => setDoomed(null) })}
      >
        The field, its boundary and its scout assignments are removed; this cannot be undone. A field with sightings or zone notices on record is kept.
      </ConfirmDialog>
    </Panel>
  );
}
