// The one way Patchwise writes dates and times, in the organisation's locale and time zone, for the app, the notice page,
// the print view and the e-mails alike.
import { isCalendarDate } from '../schemas/calendar-date.ts';

/** An organisation's way of writing dates: a BCP 47 locale and an IANA time zone. */
export interface DateFormat {
  locale: string;
  timeZone: string;
}

export const DEFAULT_DATE_FORMAT: DateFormat = { locale: 'en-GB', timeZone: 'Europe/London' };

type Style = 'date' | 'dateTime' | 'time';

const STYLE_OPTIONS: Record<Style, Intl.DateTimeFormatOptions> = {
  date: { dateStyle: 'long' },
  dateTime: { dateStyle: 'long', timeStyle: 'short' },
  time: { timeStyle: 'short' },
};

const formatters = new Map<string, Intl.DateTimeFormat>();

// Building a DateTimeFormat loads locale data; one per (locale, zone, style) is enough.
function formatter(locale: string, timeZone: string, style: Style) {
  const key = `${locale}|${timeZone}|${style}`;
  let found = formatters.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat(locale, { ...STYLE_OPTIONS[style], timeZone });
    formatters.set(key, found);
  }
  return found;
}

const instant = (value: string | Date) => (value instanceof Date ? value : new Date(value));
const valid = (d: Date) => !Number.isNaN(d.getTime());

/** The calendar day an instant falls on in the organisation's zone, e.g. "3 December 2026" in en-GB. */
export function formatDate(value: string | Date, format: DateFormat = DEFAULT_DATE_FORMAT): string {
  const d = instant(value);
  return valid(d) ? formatter(format.locale, format.timeZone, 'date').format(d) : '—';
}

/** An instant as day and clock time in the organisation's zone. */
export function formatDateTime(value: string | Date, format: DateFormat = DEFAULT_DATE_FORMAT): string {
  const d = instant(value);
  return valid(d) ? formatter(format.locale, format.timeZone, 'dateTime').format(d) : '—';
}

/** An instant's clock time in the organisation's zone. */
export function formatTime(value: string | Date, format: DateFormat = DEFAULT_DATE_FORMAT): string {
  const d = instant(value);
  return valid(d) ? formatter(format.locale, format.timeZone, 'time').format(d) : '—';
}

// A YYYY-MM-DD is a day on the calendar, not an instant: written at noon UTC and read in UTC, it is the same day in every zone.
function calendarInstant(isoDay: string) {
  if (!isCalendarDate(isoDay)) return null;
  const [year, month, day] = isoDay.split('-').map(Number);
  return new Date(Date.UTC(year, month - 1, day, 12));
}

/** A calendar date (YYYY-MM-DD: a walk's day, a re-scout date) in the organisation's locale, never shifted by its zone. */
export function formatCalendarDate(isoDay: string, format: DateFormat = DEFAULT_DATE_FORMAT): string {
  const d = calendarInstant(isoDay);
  return d ? formatter(format.locale, 'UTC', 'date').format(d) : isoDay;
}

/** A window of calendar days, either end open: "1–14 July 2026", "from 1 July 2026", "until 14 July 2026", "all dates". */
export function formatDateWindow(from: string | null | undefined, to: string | null | undefined, format: DateFormat = DEFAULT_DATE_FORMAT): string {
  const start = from ? calendarInstant(from) : null;
  const end = to ? calendarInstant(to) : null;
  if (start && end)
    return start <= end
      ? formatter(format.locale, 'UTC', 'date').formatRange(start, end)
      : `${formatCalendarDate(from!, format)} – ${formatCalendarDate(to!, format)}`;
  if (start) return `from ${formatCalendarDate(from!, format)}`;
  if (end) return `until ${formatCalendarDate(to!, format)}`;
  return 'all dates';
}

/** The calendar day (YYYY-MM-DD) an instant falls on in a time zone: "today" as the organisation means it. */
export function calendarDayIn(timeZone: string, now: Date = new Date()): string {
  const parts = new Intl.DateTimeFormat('en', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')}`;
}

/** Binds the functions above to one organisation's format, for code that writes many dates. */
export function datesIn(format: DateFormat = DEFAULT_DATE_FORMAT) {
  return {
    format,
    date: (value: string | Date) => formatDate(value, format),
    dateTime: (value: string | Date) => formatDateTime(value, format),
    time: (value: string | Date) => formatTime(value, format),
    calendarDate: (isoDay: string) => formatCalendarDate(isoDay, format),
    dateWindow: (from: string | null | undefined, to: string | null | undefined) => formatDateWindow(from, to, format),
    /** Today's calendar day in the organisation's zone (YYYY-MM-DD). */
    today: () => calendarDayIn(format.timeZone),
  };
}
export type Dates = ReturnType<typeof datesIn>;
