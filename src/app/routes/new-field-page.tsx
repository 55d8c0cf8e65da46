import { Link, useNavigate, useParams } from 'react-router';
import { PageFrame, Panel } from '../../components/page-frame.tsx';
import { useFarm } from '../../features/admin/api/get-farm.ts';
import { FieldForm } from '../../features/fields/components/field-form.tsx';

export function NewFieldPage() {
  const { farmId = '' } = useParams();
  const farm = useFarm(farmId);
  const navigate = useNavigate();
  return (
    <PageFrame
      title="New field"
      eyebrow={
        <Link to={`/admin/farms/${farmId}`} className="hover:underline">
          {farm.data?.name ?? 'Farm'}
        </Link>
      }
      wide
    >
      <Panel>
        <FieldForm farmId={farmId} onSaved={(field) => navigate(`/fields/${field.id}`)} />
      </Panel>
    </PageFrame>
  );
}
