// Route page for one needs-a-pin photo of a walk; back to the walk once it is placed.
import { useNavigate, useParams } from 'react-router';
import { PageFrame } from '../../../components/page-frame.tsx';
import { ButtonLink } from '../../../components/button.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useQuery } from '@tanstack/react-query';
import { fieldQueryOptions } from '../../../lib/api/get-field.ts';
import { PinSightingPanel } from '../../sightings/components/pin-sighting-panel.tsx';
import { useWalk, walkQueryKey } from '../api/get-walk.ts';
import { scoutPaths } from '../paths.ts';

export function PinPhotoPage() {
  const { walkId = '', sightingId = '' } = useParams();
  const navigate = useNavigate();
  const walk = useWalk(walkId);
  const field = useQuery({ ...fieldQueryOptions(walk.data?.walk.fieldId ?? ''), enabled: !!walk.data });
  const back = (
    <ButtonLink to={scoutPaths.walk(walkId)} variant="secondary" size="lg">
      Back to the walk
    </ButtonLink>
  );

  if (walk.isError)
    return (
      <PageFrame title="Pin a photo" actions={back}>
        <ErrorState error={walk.error} onRetry={() => walk.refetch()} />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Pin a photo" actions={back}>
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );
  if (!walk.data || !field.data)
    return (
      <PageFrame title="Pin a photo" actions={back}>
        <LoadingState />
      </PageFrame>
    );

  const sighting = walk.data.sightings.find((s) => s.id === sightingId);
  if (!sighting)
    return (
      <PageFrame title="Pin a photo" actions={back}>
        <ErrorState title="This photo is not on the walk" error={new Error('It may have been removed; go back to the walk.')} />
      </PageFrame>
    );

  return (
    <PageFrame title="Pin a photo" eyebrow={`${walk.data.walk.fieldName} · ${sighting.pestName}`} actions={back}>
      <PinSightingPanel
        sighting={sighting}
        boundary={{ id: field.data.id, geometry: field.data.boundary, label: field.data.name }}
        neighbours={walk.data.sightings.filter((s) => s.id !== sighting.id && s.position)}
        shownUnder={walkQueryKey(walkId)}
        onPinned={() => navigate(scoutPaths.walk(walkId))}
      />
    </PageFrame>
  );
}
