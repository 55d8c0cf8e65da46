// How a list of walks says where a walk stands: finished (with the time), still going today, or nothing at all for an
// older walk nobody marked finished (many walks ended before the mark existed, so it is not called unfinished).
import type { WalkView } from '@shared/schemas/walks.ts';
import type { Dates } from '@shared/dates/format-dates.ts';

export type WalkFinishState = Pick<WalkView, 'walkedOn' | 'finishedAt'>;

/** "Finished at 10:42", "In progress" for today's open walk, or null; `today` is YYYY-MM-DD on the device's calendar. */
export function walkFinishMark(walk: WalkFinishState, today: string, dates: Dates): string | null {
  if (walk.finishedAt) return `Finished at ${dates.time(walk.finishedAt)}`;
  return walk.walkedOn === today ? 'In progress' : null;
}
