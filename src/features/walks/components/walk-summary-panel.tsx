// "Finish walk": marks the walk finished (online only) and shows it at a glance before the scout leaves the field.
import { formatRouteLength } from '@shared/units/route-length.ts';
import type { WalkSummary, WalkView } from '@shared/schemas/walks.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useDates } from '../../../lib/dates.ts';
import { useWalkSummary } from '../api/get-walk-summary.ts';
import { useFinishWalk } from '../api/finish-walk.ts';
import { useOnline } from '../outbox/use-outbox.ts';

function SummaryFigures({ summary }: { summary: WalkSummary }) {
  const figures: Array<[string, string, string]> = [
    ['Stops', String(summary.stops), 'summary-stops'],
    ['Found', String(summary.found), 'summary-found'],
    ['Empty', String(summary.empty), 'summary-empty'],
    ['Route', formatRouteLength(summary.routeLengthM), 'summary-route'],
  ];
  return (
    <div className="space-y-3">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-base" aria-label="Walk summary">
        {figures.map(([name, value, testId]) => (
          <div key={name} className="contents">
            <dt className="text-sm text-soil-600">{name}</dt>
            <dd className="font-semibold text-soil-900" data-testid={testId}>
              {value}
            </dd>
          </div>
        ))}
      </dl>
      <p className="text-sm text-soil-700">Photos of one spot within a few metres count as one stop. The route joins the stops in the order they were made.</p>
      <p className="text-base text-soil-900" data-testid="summary-evenness">
        {summary.evenness}
      </p>
      {summary.coverage?.warnings.map((warning) => (
        <p key={warning} className="rounded bg-straw-50 px-3 py-2 text-sm text-soil-800 ring-1 ring-inset ring-straw-300">
          {warning}
        </p>
      ))}
    </div>
  );
}

/** Why the walk cannot be finished from here just now, or null when it can. */
function whyNotNow(online: boolean, keptOnPhone: boolean) {
  if (keptOnPhone) return 'This walk is still only on this phone: it can be finished once it has been sent.';
  if (!online) return 'Finishing the walk needs a connection. Your photos and stops stay on this phone meanwhile.';
  return null;
}

export function WalkSummaryPanel({ walk, keptOnPhone, waitingOnPhone }: { walk: WalkView; keptOnPhone: boolean; waitingOnPhone: number }) {
  const dates = useDates();
  const online = useOnline();
  const finish = useFinishWalk(walk.id);
  const finishedAt = walk.finishedAt ?? finish.data?.walk.finishedAt ?? null;
  const summary = useWalkSummary(walk.id, !!finishedAt);
  if (!finishedAt) {
    const notNow = whyNotNow(online, keptOnPhone);
    return (
      <div className="space-y-2">
        <Button size="lg" variant="secondary" disabled={!!notNow} busy={finish.isPending} onClick={() => finish.mutate()}>
          Finish walk
        </Button>
        {notNow && (
          <p className="text-sm text-soil-700" data-finish-needs-connection>
            {notNow}
          </p>
        )}
        {finish.isError && <FormMessage>{errorMessage(finish.error)}</FormMessage>}
      </div>
    );
  }
  return (
    <section aria-labelledby="walk-summary-title" className="space-y-3">
      <h3 id="walk-summary-title" className="text-lg font-semibold text-soil-900">
        Walk summary
      </h3>
      <p className="text-base font-semibold text-field-800" data-walk-finished>
        Finished {dates.dateTime(finishedAt)}
      </p>
      {waitingOnPhone > 0 && (
        <p role="status" className="text-sm text-soil-700">
          {waitingOnPhone === 1 ? '1 item still waits' : `${waitingOnPhone} items still wait`} on this phone and will count once sent.
        </p>
      )}
      {summary.isPending ? (
        <LoadingState label="Adding up the walk…" />
      ) : summary.isError ? (
        <ErrorState error={summary.error} title="The summary could not be loaded" onRetry={() => summary.refetch()} />
      ) : (
        <SummaryFigures summary={summary.data.summary} />
      )}
    </section>
  );
}
