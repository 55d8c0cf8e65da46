// The scout's start page: the fields assigned to them, and a way to upload without choosing one.
import { Link } from 'react-router';
import { PageFrame } from '../../../components/page-frame.tsx';
import { ButtonLink } from '../../../components/button.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useFields } from '../../../lib/api/get-fields.ts';
import { scoutPaths } from '../paths.ts';

export function MyFieldsPage() {
  const fields = useFields();
  return (
    <PageFrame title="Walk a field" eyebrow="Fields assigned to you">
      <ButtonLink to={scoutPaths.justUpload} size="lg" variant="secondary" className="w-full min-h-14 text-lg">
        Just upload: let Patchwise find the field
      </ButtonLink>
      {fields.isPending && <LoadingState />}
      {fields.isError && <ErrorState error={fields.error} onRetry={() => fields.refetch()} />}
      {fields.data?.length === 0 && (
        <EmptyState title="No fields assigned to you yet">Ask your adviser or admin to assign you the fields you scout.</EmptyState>
      )}
      {fields.data && fields.data.length > 0 && (
        <ul className="space-y-3" aria-label="Fields assigned to you">
          {fields.data.map((field) => (
            <li key={field.id}>
              <Link
                to={scoutPaths.field(field.id)}
                className="block min-h-16 rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 hover:ring-field-600 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
              >
                <span className="block text-lg font-semibold text-field-900">{field.name}</span>
                <span className="block text-sm text-soil-700">
                  {field.farmName} · {field.crop} {field.season} · <AreaText m2={field.areaM2} />
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </PageFrame>
  );
}
