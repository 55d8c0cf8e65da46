// Two stored checks side by side: earlier and later in two columns, what changed highlighted, and each one's map.
import { lazy, Suspense } from 'react';
import { Link } from 'react-router';
import type { CheckSummary } from '@shared/schemas/checks.ts';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { LoadingState } from '../../../components/query-states.tsx';
import { compareChecks } from '../check-comparison.ts';
import { useDates } from '../../../lib/dates.ts';

// The two maps bring Leaflet in; the table does not wait for them.
const ComparisonMaps = lazy(async () => ({ default: (await import('./comparison-maps.tsx')).ComparisonMaps }));

export function CheckComparison({ field, earlier, later, closeHref }: { field: Field; earlier: CheckSummary; later: CheckSummary; closeHref: string }) {
  const dates = useDates();
  const rows = compareChecks(earlier, later, dates);
  return (
    <Panel title="Two checks compared" className="space-y-3">
      <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-soil-300/60">
        <table className="min-w-full text-left text-sm" aria-label="Two checks compared" data-comparison>
          <thead className="bg-straw-100 text-xs text-soil-700">
            <tr>
              <th scope="col" className="px-2 py-1.5">
                Figure
              </th>
              <th scope="col" className="px-2 py-1.5" data-compare-check={earlier.id}>
                Earlier · {dates.dateTime(earlier.createdAt)}
              </th>
              <th scope="col" className="px-2 py-1.5" data-compare-check={later.id}>
                Later · {dates.dateTime(later.createdAt)}
              </th>
              <th scope="col" className="px-2 py-1.5">
                Change
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-straw-200 tabular-nums">
            {rows.map((row) => (
              <tr key={row.key} data-compare-row={row.key} data-changed={row.changed ? 'true' : 'false'} className={row.changed ? 'bg-patch-50' : undefined}>
                <th scope="row" className="px-2 py-1.5 font-medium text-soil-800">
                  {row.label}
                </th>
                <td className="px-2 py-1.5" data-side="earlier">
                  {row.earlier}
                </td>
                <td className="px-2 py-1.5" data-side="later">
                  {row.later}
                </td>
                <td className={`px-2 py-1.5 ${row.changed ? 'font-semibold text-patch-700' : 'text-soil-600'}`} data-side="change">
                  {row.change}
                  {row.changed && <span className="sr-only"> (changed)</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-soil-600">
        Rows that changed are shaded. Mean count per stop counts empty stops as 0, over the sightings each check took in. The figures are the stored ones of
        each check; re-running either gives the same figures for the same sightings and options.{' '}
        <Link to={closeHref} className="font-medium text-field-700 underline-offset-2 hover:underline">
          Close the comparison
        </Link>
      </p>
      <Suspense fallback={<LoadingState label="Loading the maps…" />}>
        <ComparisonMaps field={field} earlier={earlier} later={later} />
      </Suspense>
    </Panel>
  );
}
