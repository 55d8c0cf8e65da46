// Where a calendar day begins in an IANA zone. Every expected instant is the day's local midnight minus the UTC offset
// that the IANA tz database rules put in force at that moment, stated beside each case (NZ: NZDT UTC+13 from the last
// Sunday of September 02:00 to the first Sunday of April 03:00; US: CDT UTC−5 from the second Sunday of March 02:00 to
// the first Sunday of November 02:00; EU: BST from the last Sunday of March 01:00 UTC; Cuba, from memory of the tz
// "northamerica" file: "Rule Cuba 2013 max Mar Sun>=8 0:00s 1:00 D", so the clocks jump from 00:00 to 01:00).
import { describe, expect, it } from 'vitest';
import { dayAfter, startOfDayIn } from '../../shared/dates/start-of-day.ts';

describe('the start of a calendar day in an organisation’s time zone (IANA tz rules)', () => {
  it('is 11:00 UTC the day before in Auckland in summer (NZDT, UTC+13) and 12:00 UTC in winter (NZST, UTC+12)', () => {
    expect(startOfDayIn('Pacific/Auckland', '2026-03-01')).toBe('2026-02-28T11:00:00.000Z');
    expect(startOfDayIn('Pacific/Auckland', '2026-07-01')).toBe('2026-06-30T12:00:00.000Z');
  });

  it('is 05:00 UTC in Chicago in summer (CDT, UTC−5) and 06:00 UTC in winter (CST, UTC−6)', () => {
    expect(startOfDayIn('America/Chicago', '2026-07-01')).toBe('2026-07-01T05:00:00.000Z');
    expect(startOfDayIn('America/Chicago', '2026-12-01')).toBe('2026-12-01T06:00:00.000Z');
  });

  it('keeps the standard offset at midnight on the day the clocks go forward later that night', () => {
    // US: 8 March 2026 is the second Sunday of March; midnight is still CST (UTC−6), the next one CDT (UTC−5): a 23-hour day.
    expect(startOfDayIn('America/Chicago', '2026-03-08')).toBe('2026-03-08T06:00:00.000Z');
    expect(startOfDayIn('America/Chicago', dayAfter('2026-03-08'))).toBe('2026-03-09T05:00:00.000Z');
    // EU: 29 March 2026 is the last Sunday of March; midnight is GMT (UTC+0), the next one BST (UTC+1).
    expect(startOfDayIn('Europe/London', '2026-03-29')).toBe('2026-03-29T00:00:00.000Z');
    expect(startOfDayIn('Europe/London', dayAfter('2026-03-29'))).toBe('2026-03-29T23:00:00.000Z');
  });

  it('keeps the summer offset at midnight on the day the clocks go back later that night (a 25-hour day)', () => {
    // NZ: 5 April 2026 is the first Sunday of April; midnight is NZDT (UTC+13), the next one NZST (UTC+12).
    expect(startOfDayIn('Pacific/Auckland', '2026-04-05')).toBe('2026-04-04T11:00:00.000Z');
    expect(startOfDayIn('Pacific/Auckland', '2026-04-06')).toBe('2026-04-05T12:00:00.000Z');
  });

  it('begins at the jump when the clocks skip midnight itself', () => {
    // Cuba, 8 March 2026 (second Sunday of March): 00:00 CST (UTC−5) becomes 01:00 CDT at 05:00 UTC; no midnight that day.
    expect(startOfDayIn('America/Havana', '2026-03-08')).toBe('2026-03-08T05:00:00.000Z');
  });

  it('counts the Gregorian calendar across month ends and leap days', () => {
    expect(dayAfter('2026-02-28')).toBe('2026-03-01');
    expect(dayAfter('2028-02-28')).toBe('2028-02-29');
    expect(dayAfter('2026-12-31')).toBe('2027-01-01');
  });

  it('refuses a day that is not on the calendar, and a zone that is not in the database', () => {
    expect(() => startOfDayIn('Europe/London', '2026-02-30')).toThrow(RangeError);
    expect(() => startOfDayIn('America/Springfield', '2026-07-01')).toThrow(RangeError);
  });
});
