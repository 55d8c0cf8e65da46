import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import type { FarmView as Farm } from '@shared/schemas/farms.ts';
import { useFarms } from '../../../lib/api/get-farms.ts';
import { FarmForm } from './farm-form.tsx';

const column = createColumnHelper<Farm>();
const columns = [
  column.accessor('name', {
    header: 'Farm',
    cell: (info) => (
      <Link to={`/admin/farms/${info.row.original.id}`} className="font-medium text-field-700 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((f) => f.contacts.map((c) => c.name).join(', '), {
    id: 'contacts',
    header: 'Grower contacts',
    cell: (info) => info.getValue() || <span className="text-soil-500">None</span>,
  }),
];

export function FarmsPage() {
  const farms = useFarms();
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  return (
    <PageFrame title="Farms" eyebrow="Admin" actions={!adding && <Button onClick={() => setAdding(true)}>New farm</Button>}>
      {adding && (
        <Panel
          title="New farm"
          actions={
            <Button variant="quiet" size="sm" onClick={() => setAdding(false)}>
              Cancel
            </Button>
          }
        >
          <FarmForm onSaved={(farm) => navigate(`/admin/farms/${farm.id}`)} />
        </Panel>
      )}
      {farms.isPending ? (
        <LoadingState label="Loading farms…" />
      ) : farms.isError ? (
        <ErrorState error={farms.error} onRetry={() => farms.refetch()} />
      ) : farms.data.length === 0 ? (
        <EmptyState title="No farms yet" action={!adding && <Button onClick={() => setAdding(true)}>Add the first farm</Button>}>
          A farm groups fields and names the growers who receive zone notices.
        </EmptyState>
      ) : (
        <TableFrame caption="Farms" columns={columns} rows={farms.data} rowId={(f) => f.id} />
      )}
    </PageFrame>
  );
}
