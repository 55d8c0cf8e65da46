// One farm for the admin: its details and contacts, linked grower accounts, and its fields.
import { Link, useParams } from 'react-router';
import { PageFrame, Panel } from '../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../components/query-states.tsx';
import { useFarm } from '../../features/admin/api/get-farm.ts';
import { FarmForm } from '../../features/admin/components/farm-form.tsx';
import { DeleteFarmButton } from '../../features/admin/components/delete-farm-button.tsx';
import { FarmGrowersPanel } from '../../features/admin/components/farm-growers-panel.tsx';
import { FarmFieldsPanel } from '../../features/fields/components/farm-fields-panel.tsx';

export function AdminFarmPage() {
  const { farmId = '' } = useParams();
  const farm = useFarm(farmId);
  const eyebrow = (
    <Link to="/admin/farms" className="hover:underline">
      Farms
    </Link>
  );
  if (farm.isPending)
    return (
      <PageFrame title="Farm" eyebrow={eyebrow}>
        <LoadingState label="Loading the farm…" />
      </PageFrame>
    );
  if (farm.isError)
    return (
      <PageFrame title="Farm" eyebrow={eyebrow}>
        <ErrorState error={farm.error} onRetry={() => farm.refetch()} />
      </PageFrame>
    );
  return (
    <PageFrame title={farm.data.name} eyebrow={eyebrow} wide actions={<DeleteFarmButton farm={farm.data} />}>
      <FarmFieldsPanel farmId={farmId} />
      <div className="grid gap-5 lg:grid-cols-2">
        <Panel title="Farm details">
          <FarmForm key={farm.data.id} farm={farm.data} />
        </Panel>
        <FarmGrowersPanel farm={farm.data} />
      </div>
    </PageFrame>
  );
}
