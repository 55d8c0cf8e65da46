// The field's recent walks with their counts, each opening where the reader can act on it.
import { Link } from 'react-router';
import type { Role } from '@shared/schemas/roles.ts';
import type { WalkView } from '@shared/schemas/walks.ts';
import { Panel } from '../../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../../components/query-states.tsx';
import { WalkFinishMark } from '../../../../components/walk-finish-mark.tsx';
import { useWalks } from '../../../../lib/api/get-walks.ts';
import { useDates } from '../../../../lib/dates.ts';
import { reviewWindowPath } from '@shared/attention-links.ts';
import { ShowMore } from '../../../../components/show-more.tsx';

/** Walks on the first page; "Show more" loads as many again. */
const RECENT = 6;

/** Scouts open their own walk page; advisers and admins the review on that day's sightings; growers read only. */
function walkHref(role: Role, walk: WalkView): string | null {
  if (role === 'scout') return `/scout/walks/${walk.id}`;
  if (role === 'adviser' || role === 'admin') return reviewWindowPath(walk.fieldId, { from: walk.walkedOn, to: walk.walkedOn });
  return null;
}

export function FieldWalksPanel({ fieldId, role }: { fieldId: string; role: Role }) {
  const dates = useDates();
  const walks = useWalks(fieldId, RECENT);
  if (walks.isPending)
    return (
      <Panel title="Recent walks">
        <LoadingState label="Loading walks…" />
      </Panel>
    );
  // A failed next page keeps the walks already shown; only a failed first page takes the panel.
  if (walks.isError && !walks.isFetchNextPageError)
    return (
      <Panel title="Recent walks">
        <ErrorState error={walks.error} onRetry={() => walks.refetch()} />
      </Panel>
    );
  const recent = walks.data ?? [];
  return (
    <Panel title="Recent walks">
      {recent.length === 0 ? (
        <EmptyState title="No walks yet">A scout’s visit shows here with its sightings and stops.</EmptyState>
      ) : (
        <table className="w-full text-left text-sm" aria-label="Recent walks">
          <thead className="text-xs text-soil-600">
            <tr>
              <th scope="col" className="py-1 pr-2">
                Day
              </th>
              <th scope="col" className="py-1 pr-2">
                Scout
              </th>
              <th scope="col" className="py-1 pr-2">
                Finished
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                Sightings
              </th>
              <th scope="col" className="py-1 text-right">
                Empty stops
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-straw-200 tabular-nums">
            {recent.map((walk) => {
              const href = walkHref(role, walk);
              return (
                <tr key={walk.id} data-walk={walk.id}>
                  <td className="py-1.5 pr-2">
                    {href ? (
                      <Link to={href} className="font-medium text-field-700 underline-offset-2 hover:underline">
                        {dates.calendarDate(walk.walkedOn)}
                      </Link>
                    ) : (
                      dates.calendarDate(walk.walkedOn)
                    )}
                  </td>
                  <td className="py-1.5 pr-2">{walk.scoutName}</td>
                  <td className="py-1.5 pr-2" data-walk-finished>
                    <WalkFinishMark walk={walk} today={dates.today()} />
                  </td>
                  <td className="py-1.5 pr-2 text-right" data-walk-sightings>
                    {walk.sightingCount}
                  </td>
                  <td className="py-1.5 text-right" data-walk-stops>
                    {walk.stopCount}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
      <ShowMore query={walks} label="Show more walks" />
    </Panel>
  );
}
