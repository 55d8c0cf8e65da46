// The season so far: sightings and mean count per walk for the pest (the past checks have their own panel).
import { lazy, Suspense } from 'react';
import { Panel } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useFieldHistory } from '../api/get-field-history.ts';
import { ChartPlaceholder } from './chart-placeholder.tsx';

const WalkHistoryChart = lazy(() => import('./walk-history-chart.tsx').then((m) => ({ default: m.WalkHistoryChart })));

export function FieldHistoryPanel({ fieldId, pestId }: { fieldId: string; pestId?: string }) {
  const history = useFieldHistory(fieldId, pestId);
  if (history.isPending)
    return (
      <Panel title="Season history">
        <LoadingState label="Loading the season…" />
      </Panel>
    );
  if (history.isError)
    return (
      <Panel title="Season history">
        <ErrorState error={history.error} onRetry={() => history.refetch()} />
      </Panel>
    );
  const rows = history.data.walks.map((w) => {
    const figures = w.pests.find((p) => p.pestId === pestId) ?? w.pests[0];
    return { walkedOn: w.walkedOn, scout: w.scout.name, sightings: figures?.sightings ?? 0, stops: figures?.stops ?? 0, meanCount: figures?.meanCount ?? null };
  });
  return (
    <Panel title="Season history">
      {rows.length === 0 ? (
        <EmptyState title="No walks yet this season" />
      ) : (
        <figure className="h-56" aria-label="Sightings and mean count per walk">
          <Suspense fallback={<ChartPlaceholder />}>
            <WalkHistoryChart rows={rows} />
          </Suspense>
        </figure>
      )}
    </Panel>
  );
}
