// The adviser's fields table, and the large field card the farm pages use on a phone.
import { Link } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import { PageFrame } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { TableFrame } from '../../../components/table-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { useFields } from '../../../lib/api/get-fields.ts';

const column = createColumnHelper<Field>();
const columns = [
  column.accessor('name', {
    header: 'Field',
    cell: (info) => (
      <Link to={`/fields/${info.row.original.id}`} className="font-medium text-field-700 underline-offset-2 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('farmName', { header: 'Farm' }),
  column.accessor('crop', { header: 'Crop' }),
  column.accessor('season', { header: 'Season' }),
  column.accessor('areaM2', { header: 'Area', cell: (info) => <AreaText m2={info.getValue()} className="whitespace-nowrap" /> }),
  column.display({
    id: 'review',
    header: 'Review',
    cell: (info) => (
      <Link to={`/fields/${info.row.original.id}/review`} className="font-medium text-field-700 underline underline-offset-2">
        Review sightings
      </Link>
    ),
  }),
];

export function AdviserFieldsHome() {
  const fields = useFields();
  return (
    <PageFrame title="Fields" eyebrow="Every field of your advisory business" wide>
      {fields.isPending ? (
        <LoadingState label="Loading fields…" />
      ) : fields.isError ? (
        <ErrorState error={fields.error} onRetry={() => fields.refetch()} />
      ) : fields.data.length === 0 ? (
        <EmptyState title="No fields yet">An admin adds farms and their field boundaries; they appear here as soon as they are saved.</EmptyState>
      ) : (
        <TableFrame caption="Fields" columns={columns} rows={fields.data} rowId={(f) => f.id} initialSort={[{ id: 'farmName', desc: false }]} />
      )}
    </PageFrame>
  );
}
