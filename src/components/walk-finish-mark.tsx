// A walk's finish mark beside it in a list of walks: the time it was finished, or that today's walk is still going.
import { useDates } from '../lib/dates.ts';
import { localToday } from '../lib/local-today.ts';
import { walkFinishMark, type WalkFinishState } from '../lib/walk-finish-mark.ts';

/**
 * `today` says which calendar day "in progress" means: the scout's own screens use the phone's day (the day a walk
 * started on it is given, the default); desk pages pass the organisation's (`useDates().today()`).
 */
export function WalkFinishMark({ walk, today, className = '' }: { walk: WalkFinishState; today?: string; className?: string }) {
  const dates = useDates();
  const mark = walkFinishMark(walk, today ?? localToday(), dates);
  if (!mark) return null;
  const finished = Boolean(walk.finishedAt);
  return (
    <span
      className={`inline-block whitespace-nowrap rounded px-1.5 py-0.5 text-xs font-semibold ring-1 ring-inset ${finished ? 'bg-field-50 text-field-800 ring-field-600/40' : 'bg-straw-100 text-soil-900 ring-straw-500'} ${className}`}
      data-walk-finish={finished ? 'finished' : 'in-progress'}
    >
      {mark}
    </span>
  );
}
