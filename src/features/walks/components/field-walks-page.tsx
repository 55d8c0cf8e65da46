// One of the scout's fields: start (or carry on with) today's walk, or open an earlier one.
import { useNavigate, useParams } from 'react-router';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button, ButtonLink } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { WalkFinishMark } from '../../../components/walk-finish-mark.tsx';
import { ErrorState, LoadingState, EmptyState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useSignedInUser } from '../../../lib/auth.ts';
import { fieldQueryOptions } from '../../../lib/api/get-field.ts';
import { useWalks } from '../../../lib/api/get-walks.ts';
import { useStartWalk } from '../api/start-walk.ts';
import { useKeepForNoSignal } from '../hooks/use-keep-for-no-signal.ts';
import { useWalksStartedOffline } from '../outbox/use-outbox.ts';
import { scoutPaths } from '../paths.ts';
import { useDates } from '../../../lib/dates.ts';
import { localToday } from '../../../lib/local-today.ts';
import { ShowMore } from '../../../components/show-more.tsx';

export function FieldWalksPage() {
  const dates = useDates();
  const { fieldId = '' } = useParams();
  const me = useSignedInUser();
  const navigate = useNavigate();
  const field = useQuery(fieldQueryOptions(fieldId));
  const walks = useWalks(fieldId);
  const startWalk = useStartWalk();
  const startedOffline = useWalksStartedOffline();
  useKeepForNoSignal();
  const today = localToday();

  if (field.isPending)
    return (
      <PageFrame title="Field">
        <LoadingState />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Field">
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );

  const todaysOnServer = walks.data?.find((w) => w.walkedOn === today && w.scoutId === me.id)?.id;
  const todaysOnPhone = startedOffline.find((w) => w.fieldId === fieldId && w.walkedOn === today);
  const todays = todaysOnServer ?? todaysOnPhone?.serverId ?? todaysOnPhone?.id;
  const start = () =>
    startWalk.mutate({ field: { id: fieldId, name: field.data.name }, walkedOn: today }, { onSuccess: ({ walkId }) => navigate(scoutPaths.walk(walkId)) });

  return (
    <PageFrame title={field.data.name} eyebrow={`${field.data.farmName} · ${field.data.crop} ${field.data.season}`}>
      <Panel>
        <p className="mb-3 text-soil-700">
          <AreaText m2={field.data.areaM2} />
        </p>
        {todays ? (
          <ButtonLink to={scoutPaths.walk(todays)} size="lg" className="w-full min-h-14 text-lg">
            Carry on with today’s walk
          </ButtonLink>
        ) : (
          <Button size="lg" className="w-full min-h-14 text-lg" onClick={start} busy={startWalk.isPending}>
            Start a walk for today
          </Button>
        )}
        {startWalk.isError && (
          <div className="mt-2">
            <FormMessage>{errorMessage(startWalk.error)}</FormMessage>
          </div>
        )}
      </Panel>

      <Panel title="Walks on this field">
        {walks.isPending && <LoadingState />}
        {walks.isError && !walks.isFetchNextPageError && <ErrorState error={walks.error} onRetry={() => walks.refetch()} />}
        {walks.data && walks.data.length === 0 && <EmptyState title="No walks yet">Start one above when you are at the field.</EmptyState>}
        {walks.data && walks.data.length > 0 && (
          <ul className="divide-y divide-straw-200">
            {walks.data.map((w) => (
              <li key={w.id}>
                <Link to={scoutPaths.walk(w.id)} className="flex min-h-14 items-center justify-between gap-3 py-3 hover:bg-field-50">
                  <span>
                    <span className="block font-semibold text-soil-900">{dates.calendarDate(w.walkedOn)}</span>
                    <span className="block text-sm text-soil-700">{w.scoutName}</span>
                    <WalkFinishMark walk={w} className="mt-1" />
                  </span>
                  <span className="text-right text-sm text-soil-700">
                    {w.sightingCount} {w.sightingCount === 1 ? 'sighting' : 'sightings'}
                    <span className="block">
                      {w.stopCount} empty {w.stopCount === 1 ? 'stop' : 'stops'}
                    </span>
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        )}
        <ShowMore query={walks} label="Show more walks" size="md" className="mt-3 w-full min-h-12" />
      </Panel>
    </PageFrame>
  );
}
