// The field's stored checks, newest first, a page at a time: each opens in the review (its id in the address, so it can be
// shared), and any two can be chosen for a side-by-side comparison.
import { useState } from 'react';
import { Link } from 'react-router';
import type { CheckSummary } from '@shared/schemas/checks.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import type { useFieldChecks } from '../../../lib/api/get-field-checks.ts';
import { useDates } from '../../../lib/dates.ts';
import { spreadLabels } from '../../../lib/spread-labels.ts';
import { optionsText, windowText, zonesAreaText } from '../check-comparison.ts';
import { ShowMore } from '../../../components/show-more.tsx';

export function PastChecksPanel({
  checks,
  openedId,
  comparedId,
  openHref,
  onCompare,
}: {
  checks: ReturnType<typeof useFieldChecks>;
  openedId: string | null;
  comparedId: string | null;
  openHref: (check: CheckSummary) => string;
  onCompare: (first: CheckSummary, second: CheckSummary) => void;
}) {
  const dates = useDates();
  const [chosen, setChosen] = useState<string[]>([]);
  if (checks.isPending)
    return (
      <Panel title="Past checks">
        <LoadingState label="Loading the field’s checks…" />
      </Panel>
    );
  // A failed next page keeps the checks already shown; only a failed first page takes the panel.
  if (checks.isError && !checks.isFetchNextPageError)
    return (
      <Panel title="Past checks">
        <ErrorState error={checks.error} onRetry={() => checks.refetch()} />
      </Panel>
    );
  const rows = checks.data ?? [];
  if (rows.length === 0)
    return (
      <Panel title="Past checks">
        <EmptyState title="No checks on this field yet">Every check you run is stored here with its window and options.</EmptyState>
      </Panel>
    );

  // Choosing a third drops the oldest choice, so two stay chosen.
  const toggle = (id: string) => setChosen((now) => (now.includes(id) ? now.filter((c) => c !== id) : [...now, id].slice(-2)));
  const pair = chosen.map((id) => rows.find((c) => c.id === id)).filter((c): c is CheckSummary => Boolean(c));
  return (
    <Panel title="Past checks">
      <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-soil-300/60">
        <table className="min-w-full text-left text-sm" aria-label="Past checks of this field">
          <thead className="bg-straw-100 text-xs text-soil-700">
            <tr>
              <th scope="col" className="px-2 py-1.5">
                Compare
              </th>
              <th scope="col" className="px-2 py-1.5">
                Pest · window
              </th>
              <th scope="col" className="px-2 py-1.5">
                Walks included
              </th>
              <th scope="col" className="px-2 py-1.5 text-right">
                Sightings and empty stops
              </th>
              <th scope="col" className="px-2 py-1.5">
                Options
              </th>
              <th scope="col" className="px-2 py-1.5">
                Spread
              </th>
              <th scope="col" className="px-2 py-1.5">
                Zones
              </th>
              <th scope="col" className="px-2 py-1.5">
                Run
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-straw-200">
            {rows.map((c) => {
              const opened = c.id === openedId || c.id === comparedId;
              return (
                <tr key={c.id} data-check-row={c.id} aria-current={c.id === openedId ? 'true' : undefined} className={opened ? 'bg-field-50' : undefined}>
                  <td className="px-2 py-1.5">
                    <input
                      type="checkbox"
                      className="h-4 w-4 rounded border-soil-300 text-field-700 focus:ring-field-600"
                      aria-label={`Compare the check of ${dates.dateTime(c.createdAt)}`}
                      checked={chosen.includes(c.id)}
                      disabled={c.status !== 'done'}
                      onChange={() => toggle(c.id)}
                    />
                  </td>
                  <td className="px-2 py-1.5">
                    <Link to={openHref(c)} className="font-medium text-field-700 underline-offset-2 hover:underline">
                      {c.pestName} · {windowText(c, dates)}
                    </Link>
                  </td>
                  <td className="px-2 py-1.5 tabular-nums">{c.walkDates.length === 0 ? '—' : c.walkDates.map(dates.calendarDate).join(', ')}</td>
                  <td className="px-2 py-1.5 text-right tabular-nums">{c.sightings}</td>
                  <td className="px-2 py-1.5 text-xs text-soil-700">{optionsText(c)}</td>
                  <td className="px-2 py-1.5" data-summary-verdict={c.verdict ?? c.status}>
                    {c.verdict ? spreadLabels[c.verdict] : c.status}
                  </td>
                  <td className="px-2 py-1.5 text-xs">{c.status === 'done' ? zonesAreaText(c) : '—'}</td>
                  <td className="px-2 py-1.5 text-xs text-soil-700">
                    {dates.dateTime(c.createdAt)}
                    {c.createdBy.name ? ` · ${c.createdBy.name}` : ''}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <ShowMore query={checks} label="Show more checks" />
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button variant="secondary" size="sm" disabled={pair.length !== 2} onClick={() => onCompare(pair[0], pair[1])}>
          Compare the two chosen
        </Button>
        <span className="text-xs text-soil-600">{pair.length === 2 ? 'Opens both side by side below.' : 'Tick two finished checks to compare them.'}</span>
      </div>
    </Panel>
  );
}
