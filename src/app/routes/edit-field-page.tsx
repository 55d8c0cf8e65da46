import { Link, useNavigate, useParams } from 'react-router';
import { PageFrame, Panel } from '../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../components/query-states.tsx';
import { useUsers } from '../../features/admin/api/get-users.ts';
import { useField } from '../../lib/api/get-field.ts';
import { FieldForm } from '../../features/fields/components/field-form.tsx';
import { FieldScoutsPanel } from '../../features/fields/components/field-scouts-panel.tsx';

export function EditFieldPage() {
  const { fieldId = '' } = useParams();
  const field = useField(fieldId);
  const users = useUsers();
  const navigate = useNavigate();
  if (field.isPending)
    return (
      <PageFrame title="Edit field">
        <LoadingState label="Loading the field…" />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Edit field">
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );
  const f = field.data;
  return (
    <PageFrame
      title={`Edit ${f.name}`}
      eyebrow={
        <Link to={`/admin/farms/${f.farmId}`} className="hover:underline">
          {f.farmName}
        </Link>
      }
      wide
    >
      <Panel>
        <FieldForm key={f.id} farmId={f.farmId} field={f} onSaved={(saved) => navigate(`/fields/${saved.id}`)} />
      </Panel>
      {users.isPending ? (
        <LoadingState label="Loading scouts…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => users.refetch()} />
      ) : (
        <FieldScoutsPanel field={f} scouts={users.data.filter((u) => u.role === 'scout')} />
      )}
    </PageFrame>
  );
}
