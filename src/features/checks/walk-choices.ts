// The review table's walk filter: one choice per walk among the sightings, newest day first, named by its day as the
// organisation writes dates and by its scout.
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { Dates } from '@shared/dates/format-dates.ts';

type WalkOf = Pick<SightingView, 'walkId' | 'walkedOn' | 'scoutName'>;

/**
 * `markOf` gives a walk's finish mark ("Finished at 10:42", "In progress") when it is known; a walk without one is
 * named by its day and scout alone.
 */
export function walkChoices(
  sightings: readonly WalkOf[],
  dates: Dates,
  markOf: (walkId: string) => string | null = () => null,
): Array<readonly [string, string]> {
  const walks = new Map<string, WalkOf>();
  for (const s of sightings) if (!walks.has(s.walkId)) walks.set(s.walkId, s);
  // Sorted on the YYYY-MM-DD day itself: written out, "9 July" would sort after "10 July".
  return [...walks.values()]
    .sort((a, b) => b.walkedOn.localeCompare(a.walkedOn) || a.scoutName.localeCompare(b.scoutName))
    .map((w) => {
      const mark = markOf(w.walkId);
      return [w.walkId, `${dates.calendarDate(w.walkedOn)} · ${w.scoutName}${mark ? ` · ${mark}` : ''}`] as const;
    });
}
