// One field's hub: its boundary and facts, recent walks, the latest check, the current zones, the notices and
// what needs attention here, each linking on. Lazy-loaded, since it brings the map in.
import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { MapFrame } from '../../../components/map-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { ButtonLink } from '../../../components/button.tsx';
import { useSignedInUser } from '../../../lib/auth.ts';
import { useField } from '../../../lib/api/get-field.ts';
import { useNotices } from '../../../lib/api/get-notices.ts';
import { FieldWalksPanel } from './hub/field-walks-panel.tsx';
import { LatestCheckPanel } from './hub/latest-check-panel.tsx';
import { FieldZoneSetsPanel } from './hub/field-zone-sets-panel.tsx';
import { FieldNoticesList } from './hub/field-notices-list.tsx';
import { FieldAttentionPanel } from './hub/field-attention-panel.tsx';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">{label}</dt>
      <dd className="mt-0.5 text-base text-soil-900">{children}</dd>
    </div>
  );
}

export function FieldPage() {
  const { fieldId = '' } = useParams();
  const user = useSignedInUser();
  const field = useField(fieldId);
  const advises = user.role === 'adviser' || user.role === 'admin';

  if (field.isPending)
    return (
      <PageFrame title="Field">
        <LoadingState label="Loading the field…" />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Field">
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );

  const f = field.data;
  return (
    <PageFrame
      title={f.name}
      eyebrow={
        user.role === 'admin' ? (
          <Link to={`/admin/farms/${f.farmId}`} className="hover:underline">
            {f.farmName}
          </Link>
        ) : (
          f.farmName
        )
      }
      actions={
        <>
          {advises && <ButtonLink to={`/fields/${f.id}/review`}>Review sightings</ButtonLink>}
          {user.role === 'admin' && (
            <ButtonLink to={`/admin/fields/${f.id}/edit`} variant="secondary">
              Edit field
            </ButtonLink>
          )}
        </>
      }
      wide
    >
      <div className="grid gap-5 lg:grid-cols-[1fr_18rem]">
        <MapFrame boundaries={[{ id: f.id, geometry: f.boundary, label: f.name }]} label={`Boundary of ${f.name}`} className="h-[22rem] sm:h-[30rem]" />
        <Panel title="About this field">
          <dl className="grid grid-cols-2 gap-4 lg:grid-cols-1">
            <Fact label="Farm">{f.farmName}</Fact>
            <Fact label="Crop">{f.crop}</Fact>
            <Fact label="Season">{f.season}</Fact>
            <Fact label="Area">
              <AreaText m2={f.areaM2} />
            </Fact>
          </dl>
        </Panel>
      </div>
      {advises && <AdviserHub fieldId={f.id} />}
      <div className="grid gap-5 lg:grid-cols-2">
        <FieldWalksPanel fieldId={f.id} role={user.role} />
        {(advises || user.role === 'grower') && <FieldZoneSetsPanel fieldId={f.id} canEdit={advises} />}
      </div>
    </PageFrame>
  );
}

/** What only advisers and admins read: the attention lines, the latest check and the notices. */
function AdviserHub({ fieldId }: { fieldId: string }) {
  const notices = useNotices(fieldId);
  return (
    <>
      <FieldAttentionPanel fieldId={fieldId} noticeIds={notices.data?.map((n) => n.id) ?? []} />
      <div className="grid gap-5 lg:grid-cols-2">
        <LatestCheckPanel fieldId={fieldId} />
        <FieldNoticesList fieldId={fieldId} />
      </div>
    </>
  );
}
