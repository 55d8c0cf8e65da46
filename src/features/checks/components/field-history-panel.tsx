// The season so far: sightings and mean count per walk for the pest, and the field's past checks.
import { lazy, Suspense } from 'react';
import { Link } from 'react-router';
import type { CheckSummary } from '@shared/schemas/checks.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useFieldHistory } from '../api/get-field-history.ts';
import { dateTime, spreadLabels } from '../utils/figures.ts';
import { ChartPlaceholder } from './chart-placeholder.tsx';

const WalkHistoryChart = lazy(() => import('./walk-history-chart.tsx').then((m) => ({ default: m.WalkHistoryChart })));

export function FieldHistoryPanel({ fieldId, pestId, reviewHref }: { fieldId: string; pestId?: string; reviewHref: (check: CheckSummary) => string }) {
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
      <div className="grid gap-5 lg:grid-cols-[3fr_2fr]">
        {rows.length === 0 ? (
          <EmptyState title="No walks yet this season" />
        ) : (
          <figure className="h-56" aria-label="Sightings and mean count per walk">
            <Suspense fallback={<ChartPlaceholder />}>
              <WalkHistoryChart rows={rows} />
            </Suspense>
          </figure>
        )}
        <div>
          <h3 className="mb-1 text-sm font-semibold text-field-800">Past checks</h3>
          {history.data.checks.length === 0 ? (
            <p className="text-sm text-soil-600">No checks on this field yet.</p>
          ) : (
            <ul className="max-h-52 divide-y divide-straw-200 overflow-y-auto text-sm">
              {history.data.checks.map((c) => (
                <li key={c.id} className="flex items-center justify-between gap-2 py-1.5">
                  <Link to={reviewHref(c)} className="font-medium text-field-700 underline-offset-2 hover:underline">
                    {c.pestName} · {c.from ?? 'season start'} – {c.to ?? 'today'}
                  </Link>
                  <span className="text-xs text-soil-600">
                    {c.verdict ? spreadLabels[c.verdict] : c.status} · n {c.n ?? '—'} · {dateTime(c.createdAt)}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </Panel>
  );
}
