// "Finish walk": the walk at a glance before the scout leaves the field.
import { useState } from 'react';
import { formatRouteLength } from '@shared/units/route-length.ts';
import type { WalkSummary } from '@shared/schemas/walks.ts';
import { Button } from '../../../components/button.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useWalkSummary } from '../api/get-walk-summary.ts';

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

export function WalkSummaryPanel({ walkId, waitingOnPhone }: { walkId: string; waitingOnPhone: number }) {
  const [finished, setFinished] = useState(false);
  const summary = useWalkSummary(walkId, finished);
  if (!finished)
    return (
      <Button size="lg" variant="secondary" onClick={() => setFinished(true)}>
        Finish walk
      </Button>
    );
  return (
    <section aria-labelledby="walk-summary-title" className="space-y-3">
      <h3 id="walk-summary-title" className="text-lg font-semibold text-soil-900">
        Walk summary
      </h3>
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
