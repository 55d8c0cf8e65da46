// The scout's walk: tag and send photos, record empty stops, and see the walk on its field.
import { useEffect } from 'react';
import { useNavigate, useParams } from 'react-router';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useQuery } from '@tanstack/react-query';
import { fieldQueryOptions } from '../../../lib/api/get-field.ts';
import { usePests } from '../../../lib/api/get-pests.ts';
import { SightingList } from '../../sightings/components/sighting-list.tsx';
import { RemovedSightings } from '../../sightings/components/removed-sightings.tsx';
import { useSignedInUser } from '../../../lib/auth.ts';
import { useWalk, walkQueryKey } from '../api/get-walk.ts';
import { useBatchTags } from '../hooks/use-batch-tags.ts';
import { scoutPaths } from '../paths.ts';
import { EmptyStopButton } from './empty-stop-button.tsx';
import { PestCountPicker } from './pest-count-picker.tsx';
import { PhotoUploadPanel } from './photo-upload-panel.tsx';
import { WalkHeader } from './walk-header.tsx';
import { WalkMap } from './walk-map.tsx';
import { QueuedStops } from './queued-stops.tsx';
import { WalkSummaryPanel } from './walk-summary-panel.tsx';
import type { QueuedPlace } from './queued-markers.tsx';
import { useOutbox } from '../outbox/use-outbox.ts';
import { unsentCount } from '../upload-queue.ts';
import type { QueuedItem, QueuedStop } from '../outbox/outbox-store.ts';
import { useDates } from '../../../lib/dates.ts';

/** Items of this walk still on the phone (sent ones are sightings on the map already), where their position is known. */
function queuedPlacesOf(items: QueuedItem[]): QueuedPlace[] {
  return items.flatMap((item) => {
    if (item.state === 'sent') return [];
    const where = item.kind === 'stop' ? { lon: item.lon, lat: item.lat } : item.position;
    return where ? [{ clientId: item.clientId, kind: item.kind, ...where, refused: item.state === 'refused' }] : [];
  });
}

export function WalkPage() {
  const dates = useDates();
  const { walkId = '' } = useParams();
  const me = useSignedInUser();
  const navigate = useNavigate();
  const walk = useWalk(walkId, me.name);
  const fieldId = walk.data?.walk.fieldId ?? '';
  const field = useQuery({ ...fieldQueryOptions(fieldId), enabled: !!walk.data });
  const pests = usePests(false);
  const tags = useBatchTags();
  const outbox = useOutbox();
  const keptOnPhone = walk.data?.keptOnPhone ?? false;
  const shownId = walk.data?.walk.id;
  const { refetch } = walk;
  // A walk started without signal: ask again as the outbox moves, until the server has it.
  useEffect(() => {
    if (keptOnPhone) void refetch();
  }, [keptOnPhone, outbox, refetch]);
  // The server answered with the walk the scout had already started there today: carry on under its id.
  useEffect(() => {
    if (shownId && shownId !== walkId) void navigate(scoutPaths.walk(shownId), { replace: true });
  }, [shownId, walkId, navigate]);

  if (walk.isPending)
    return (
      <PageFrame title="Walk">
        <LoadingState label="Loading the walk…" />
      </PageFrame>
    );
  if (walk.isError)
    return (
      <PageFrame title="Walk">
        <ErrorState error={walk.error} onRetry={() => walk.refetch()} />
      </PageFrame>
    );

  const { walk: info, sightings } = walk.data;
  // A walk kept by the phone before removals were listed has no `removed`.
  const removed = walk.data.removed ?? [];
  const pestList = pests.data ?? [];
  const pest = pestList.find((p) => p.id === tags.pestId);
  const needsPin = sightings.filter((s) => s.status === 'needs-pin');
  const placedIds = new Set(sightings.filter((s) => s.status === 'placed').map((s) => s.id));
  const queuedStops = outbox.filter((item): item is QueuedStop => item.kind === 'stop' && item.walkId === info.id);
  const queuedPlaces = queuedPlacesOf(outbox.filter((item) => item.walkId === info.id));

  return (
    <PageFrame title={info.fieldName} eyebrow={`Walk · ${dates.calendarDate(info.walkedOn)}`}>
      <Panel>
        <WalkHeader walk={info} farmName={field.data?.farmName} />
        {keptOnPhone && (
          <p className="mt-3 rounded-md bg-straw-100 px-3 py-2 text-sm text-soil-900" role="status" data-walk-kept-on-phone>
            Started on this phone without signal. Record photos and stops as usual: they wait here and go, with the walk, when the phone has signal.
          </p>
        )}
      </Panel>

      <Panel title="Photos and stops">
        <div className="space-y-4">
          {pests.isError ? (
            <ErrorState error={pests.error} title="The pest library could not be loaded" onRetry={() => pests.refetch()} />
          ) : (
            <PestCountPicker
              pests={pestList}
              crop={field.data?.crop}
              pestId={pest ? tags.pestId : ''}
              count={tags.count}
              onPest={tags.setPestId}
              onCount={tags.setCount}
            />
          )}
          <PhotoUploadPanel target={{ walkId: info.id, fieldId: info.fieldId }} pestId={pest ? tags.pestId : ''} count={tags.count} pinnedIds={placedIds} />
          <EmptyStopButton walkId={info.id} pestId={pest ? tags.pestId : ''} pestName={pest?.name} />
          <QueuedStops stops={queuedStops} />
        </div>
      </Panel>

      {needsPin.length > 0 && (
        <Panel title={`Needs a pin (${needsPin.length})`} className="ring-2 ring-straw-400">
          <p className="mb-2 text-sm text-soil-700">These photos carry no usable position. Tap “Pin it” and show where each was taken.</p>
          <SightingList sightings={needsPin} pinHref={(s) => scoutPaths.pin(info.id, s.id)} />
        </Panel>
      )}

      <Panel title="Map">
        {field.data ? (
          <WalkMap field={field.data} sightings={sightings} queued={queuedPlaces} />
        ) : field.isError ? (
          <ErrorState error={field.error} onRetry={() => field.refetch()} />
        ) : (
          <LoadingState label="Loading the field…" />
        )}
      </Panel>

      <Panel title={`Sightings (${sightings.length})`}>
        {sightings.length ? (
          <SightingList
            sightings={sightings}
            pinHref={(s) => scoutPaths.pin(info.id, s.id)}
            correction={{ pests: pestList, crop: field.data?.crop, shownUnder: walkQueryKey(info.id) }}
            removal={{ mayRemove: (s) => s.scoutId === me.id || me.role === 'adviser' || me.role === 'admin', shownUnder: walkQueryKey(info.id) }}
          />
        ) : (
          <p className="text-soil-700">Nothing yet: send photos or record a stop where you found nothing.</p>
        )}
      </Panel>

      {removed.length > 0 && (
        <Panel title={`Removed (${removed.length})`}>
          <RemovedSightings removed={removed} shownUnder={walkQueryKey(info.id)} />
        </Panel>
      )}

      <Panel title="Finish">
        <WalkSummaryPanel walk={info} keptOnPhone={keptOnPhone} waitingOnPhone={unsentCount(outbox.filter((item) => item.walkId === info.id))} />
      </Panel>
    </PageFrame>
  );
}
