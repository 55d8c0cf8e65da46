// Where a calendar day begins in an IANA time zone, as an instant: the Notices filter's "from" and "to" days are the
// organisation's days, not the reader's. Worked out with Intl (ECMA-402), which carries the tz database in every browser
// and in Node: no date library is a dependency, and the little arithmetic needed (one offset, one check) is below.
import { isCalendarDate } from '../schemas/calendar-date.ts';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const clocks = new Map<string, Intl.DateTimeFormat>();

function clock(timeZone: string) {
  let found = clocks.get(timeZone);
  if (!found) {
    found = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    clocks.set(timeZone, found);
  }
  return found;
}

/** The zone's wall clock at an instant, read as if it were UTC (milliseconds since the epoch). */
function wallClock(timeZone: string, instant: number) {
  const parts: Record<string, number> = {};
  for (const part of clock(timeZone).formatToParts(instant)) if (part.type !== 'literal') parts[part.type] = Number(part.value);
  return Date.UTC(parts.year, parts.month - 1, parts.day, parts.hour, parts.minute, parts.second);
}

/** The zone's offset from UTC at an instant, in milliseconds (east positive). */
const offsetAt = (timeZone: string, instant: number) => wallClock(timeZone, instant) - Math.floor(instant / 1000) * 1000;

function midnightAsUtc(isoDay: string) {
  if (!isCalendarDate(isoDay)) throw new RangeError(`Not a calendar day (YYYY-MM-DD): ${isoDay}`);
  const [year, month, day] = isoDay.split('-').map(Number);
  return Date.UTC(year, month - 1, day);
}

/**
 * The first instant of a calendar day (YYYY-MM-DD) in an IANA time zone, as an ISO string: local midnight, or, where the
 * clocks skip midnight (a daylight-saving change at 00:00), the moment they jump past it.
 */
export function startOfDayIn(timeZone: string, isoDay: string): string {
  const midnight = midnightAsUtc(isoDay);
  // Midnight happens at one of the offsets in force around the day; try the earlier one first (a repeated midnight counts once).
  const candidates = [midnight - offsetAt(timeZone, midnight - DAY), midnight - offsetAt(timeZone, midnight + DAY)].sort((a, b) => a - b);
  const exact = candidates.find((t) => wallClock(timeZone, t) === midnight);
  if (exact !== undefined) return new Date(exact).toISOString();
  // No midnight that day: the day begins at the jump, the first instant whose wall clock reads the day (to the second).
  let [before, after] = [candidates[0] - DAY / 2, candidates[1] + DAY / 2];
  while (after - before > 1000) {
    const middle = Math.floor((before + after) / 2000) * 1000;
    if (wallClock(timeZone, middle) >= midnight) after = middle;
    else before = middle;
  }
  return new Date(after).toISOString();
}

/** The calendar day after a YYYY-MM-DD, by the Gregorian calendar. */
export function dayAfter(isoDay: string): string {
  return new Date(midnightAsUtc(isoDay) + DAY).toISOString().slice(0, 10);
}
