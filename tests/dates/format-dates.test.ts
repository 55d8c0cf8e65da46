// Expected strings come from the Unicode CLDR date patterns that ECMA-402's Intl.DateTimeFormat applies (CLDR 42+ as shipped
// with Node's ICU): long date en-GB "d MMMM y", en-US "MMMM d, y", de "d. MMMM y"; short time en-GB/de "HH:mm", en-US "h:mm a".
// Zone offsets come from the IANA tz database rules for the dates used, stated beside each case.
import { describe, expect, it } from 'vitest';
import { calendarDayIn, formatCalendarDate, formatDate, formatDateTime, formatDateWindow, formatTime } from '../../shared/dates/format-dates.ts';
import { dateFormatSchema } from '../../shared/schemas/date-format.ts';

// ICU writes a narrow no-break space (U+202F) before AM/PM in some versions and a plain one in others: compare with spaces folded.
const folded = (text: string) => text.replace(/[\u202f\u00a0]/g, ' ');

const MONTHS_EN = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** The calendar day (d MMMM y) an instant falls on at a fixed UTC offset, by plain arithmetic on milliseconds. */
function dayAtOffset(isoInstant: string, offsetHours: number) {
  const shifted = new Date(Date.parse(isoInstant) + offsetHours * 3_600_000);
  return `${shifted.getUTCDate()} ${MONTHS_EN[shifted.getUTCMonth()]} ${shifted.getUTCFullYear()}`;
}

describe('dates in the organisation’s locale (CLDR long date patterns)', () => {
  const londonSummerNoon = '2026-07-03T11:00:00Z'; // 12:00 BST (UTC+1, EU summer time, IANA "EU" rules)

  it('writes the day first in en-GB: d MMMM y', () => {
    expect(formatDate(londonSummerNoon, { locale: 'en-GB', timeZone: 'Europe/London' })).toBe('3 July 2026');
  });

  it('writes the month first in en-US: MMMM d, y', () => {
    expect(formatDate(londonSummerNoon, { locale: 'en-US', timeZone: 'Europe/London' })).toBe('July 3, 2026');
  });

  it('writes a day with a full stop and the German month in de-DE: d. MMMM y', () => {
    expect(formatDate(londonSummerNoon, { locale: 'de-DE', timeZone: 'Europe/Berlin' })).toBe('3. Juli 2026');
  });

  it('writes the clock time in 24 hours for en-GB and de-DE and in 12 hours for en-US (HH:mm, h:mm a)', () => {
    const instant = '2026-07-03T13:05:00Z'; // 14:05 BST (UTC+1), 15:05 CEST (UTC+2), 08:05 CDT (UTC−5)
    expect(formatTime(instant, { locale: 'en-GB', timeZone: 'Europe/London' })).toBe('14:05');
    expect(formatTime(instant, { locale: 'de-DE', timeZone: 'Europe/Berlin' })).toBe('15:05');
    expect(folded(formatTime(instant, { locale: 'en-US', timeZone: 'America/Chicago' }))).toBe('8:05 AM');
  });

  it('puts the date and the time of a date-time in the same zone', () => {
    const text = formatDateTime('2026-07-03T13:05:00Z', { locale: 'en-GB', timeZone: 'Europe/London' });
    expect(text).toContain('3 July 2026');
    expect(text).toContain('14:05');
  });
});

describe('an instant near midnight UTC lands on the calendar day of the organisation’s zone', () => {
  // IANA tz "NZ" rules: NZDT (UTC+13) from the last Sunday of September to the first Sunday of April, NZST (UTC+12) otherwise.
  // IANA tz "US" rules: CDT (UTC−5) from the second Sunday of March to the first Sunday of November, CST (UTC−6) otherwise.
  const cases = [
    { instant: '2026-01-15T11:30:00Z', zone: 'Pacific/Auckland', offset: 13 },
    { instant: '2026-01-15T23:30:00Z', zone: 'Pacific/Auckland', offset: 13 },
    { instant: '2026-07-01T23:30:00Z', zone: 'Pacific/Auckland', offset: 12 },
    { instant: '2026-01-16T00:30:00Z', zone: 'America/Chicago', offset: -6 },
    { instant: '2026-07-02T00:30:00Z', zone: 'America/Chicago', offset: -5 },
    { instant: '2026-07-01T23:30:00Z', zone: 'America/Chicago', offset: -5 },
  ];
  for (const { instant, zone, offset } of cases) {
    it(`${instant} is ${dayAtOffset(instant, offset)} in ${zone} (UTC${offset > 0 ? '+' : '−'}${Math.abs(offset)})`, () => {
      expect(formatDate(instant, { locale: 'en-GB', timeZone: zone })).toBe(dayAtOffset(instant, offset));
    });
  }

  it('tells the two zones apart on the same instant: the next day in Auckland, the same day in Chicago', () => {
    const instant = '2026-01-15T11:30:00Z';
    expect(formatDate(instant, { locale: 'en-GB', timeZone: 'Pacific/Auckland' })).toBe('16 January 2026');
    expect(formatDate(instant, { locale: 'en-GB', timeZone: 'America/Chicago' })).toBe('15 January 2026');
  });
});

describe('calendar dates (YYYY-MM-DD) are days, not instants', () => {
  // Kiritimati keeps UTC+14 and Pago Pago UTC−11 (IANA tz): a UTC-midnight instant would move a day in one of them.
  for (const zone of ['Pacific/Kiritimati', 'Pacific/Pago_Pago', 'Pacific/Auckland', 'America/Chicago', 'Europe/London']) {
    it(`keeps 29 March 2026 on 29 March in ${zone}`, () => {
      expect(formatCalendarDate('2026-03-29', { locale: 'en-GB', timeZone: zone })).toBe('29 March 2026');
    });
  }

  it('writes a calendar date in the locale’s own pattern', () => {
    expect(formatCalendarDate('2026-12-03', { locale: 'en-US', timeZone: 'Pacific/Kiritimati' })).toBe('December 3, 2026');
    expect(formatCalendarDate('2026-12-03', { locale: 'de-DE', timeZone: 'Pacific/Pago_Pago' })).toBe('3. Dezember 2026');
  });

  it('leaves text that is not a calendar date as it was rather than inventing a day', () => {
    expect(formatCalendarDate('2026-02-30', { locale: 'en-GB', timeZone: 'Europe/London' })).toBe('2026-02-30');
  });
});

describe('date windows', () => {
  const gb = { locale: 'en-GB', timeZone: 'Pacific/Auckland' };

  it('writes a window inside one month with the month once (CLDR interval format "d–d MMMM y")', () => {
    expect(folded(formatDateWindow('2026-07-01', '2026-07-14', gb)).replace(/\s*–\s*/, '–')).toBe('1–14 July 2026');
  });

  it('writes a one-day window as that day', () => {
    expect(formatDateWindow('2026-07-01', '2026-07-01', gb)).toBe('1 July 2026');
  });

  it('says which end is open', () => {
    expect(formatDateWindow('2026-07-01', null, gb)).toBe('from 1 July 2026');
    expect(formatDateWindow(undefined, '2026-07-14', gb)).toBe('until 14 July 2026');
    expect(formatDateWindow(null, null, gb)).toBe('all dates');
  });
});

describe('the organisation’s date format setting', () => {
  it('accepts a BCP 47 tag and an IANA zone, and writes the tag in its canonical case (ECMA-402 Intl.getCanonicalLocales)', () => {
    expect(dateFormatSchema.parse({ locale: 'EN-us', timeZone: 'America/Chicago' })).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
  });

  it('refuses a tag with an underscore (not BCP 47) and says how to write one', () => {
    const result = dateFormatSchema.safeParse({ locale: 'en_GB', timeZone: 'Europe/London' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toMatch(/en-GB/);
  });

  it('refuses a zone the IANA database does not have', () => {
    const result = dateFormatSchema.safeParse({ locale: 'en-GB', timeZone: 'Europe/Atlantis' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].path).toEqual(['timeZone']);
  });
});

describe('calendarDayIn', () => {
  // IANA tz database rules for 2026: Pacific/Auckland is UTC+12 (NZST) on 1 July, America/Chicago UTC−5 (CDT).
  it('gives the day an instant falls on in each zone', () => {
    const instant = new Date('2026-07-01T13:00:00Z');
    expect(calendarDayIn('Pacific/Auckland', instant)).toBe('2026-07-02'); // 01:00 on 2 July
    expect(calendarDayIn('America/Chicago', instant)).toBe('2026-07-01'); // 08:00 on 1 July
    expect(calendarDayIn('UTC', new Date('2026-12-31T23:59:59Z'))).toBe('2026-12-31');
  });
});
