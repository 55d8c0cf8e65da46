// Keyset page cursors: the sort key of a page's last row, base64url JSON, checked value by value on the way back in so a
// forged one never reaches a query. A cursor names a position only; each list's WHERE keeps its own organisation and field.
import { badRequest } from '../errors.ts';
import { isCalendarDate } from '../../shared/schemas/calendar-date.ts';
import { PAGE_CURSOR_MESSAGE } from '../../shared/schemas/page.ts';

export type CursorPart = 'date' | 'timestamp' | 'uuid';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
/** PostgreSQL's text of a timestamptz, e.g. 2026-07-01 09:30:00.123456+00; `infinity` stands in for a missing time sorted last. */
const TIMESTAMP = /^(\d{4}-\d{2}-\d{2}) ([01]\d|2[0-3]):[0-5]\d:[0-5]\d(\.\d{1,6})?[+-]\d{2}(:[0-5]\d)?$/;

const valid: Record<CursorPart, (text: string) => boolean> = {
  date: isCalendarDate,
  timestamp: (text) => {
    if (text === 'infinity') return true;
    const parts = TIMESTAMP.exec(text);
    return !!parts && isCalendarDate(parts[1]);
  },
  uuid: (text) => UUID.test(text),
};

export const encodePageCursor = (key: string[]) => Buffer.from(JSON.stringify(key)).toString('base64url');

/** The sort key a cursor names, of the parts the list sorts on; anything else is refused with a way out. */
export function decodePageCursor(cursor: string, parts: readonly CursorPart[]): string[] {
  try {
    const key = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as unknown;
    if (Array.isArray(key) && key.length === parts.length && key.every((value, i) => typeof value === 'string' && valid[parts[i]](value)))
      return key as string[];
  } catch {
    // Falls through to the one message below.
  }
  throw badRequest(PAGE_CURSOR_MESSAGE, { cursor: 'Start again from the first page.' });
}

/**
 * One page from rows fetched with one more than the limit: the extra row only tells that another page follows.
 * `key` gives a row's sort key as the cursor stores it.
 */
export function pageOf<Row>(rows: Row[], limit: number, key: (row: Row) => string[]) {
  const page = rows.slice(0, limit);
  return { page, nextCursor: rows.length > limit ? encodePageCursor(key(page.at(-1)!)) : null };
}
