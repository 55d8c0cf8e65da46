import { z } from 'zod';

const DATE_SHAPE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a YYYY-MM-DD that names a day of the Gregorian calendar (2026-02-30 does not). Never throws. */
export function isCalendarDate(text: string) {
  const parts = DATE_SHAPE.exec(text);
  if (!parts) return false;
  const [year, month, day] = parts.slice(1).map(Number);
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/** A date given as YYYY-MM-DD: one sentence for the wrong shape, another for a day that does not exist. */
export function calendarDateSchema(messages: { shape: string; notADay: string }) {
  return z.string({ error: messages.shape }).regex(DATE_SHAPE, { error: messages.shape, abort: true }).refine(isCalendarDate, { error: messages.notADay });
}
