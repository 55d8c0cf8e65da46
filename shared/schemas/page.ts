// The page part of a list's query (limit + an opaque cursor) and of its answer (nextCursor), one wording for every list.
import { z } from 'zod';

export const PAGE_CURSOR_MESSAGE = 'That page cursor is not valid; start again from the first page.';

/** `limit` and `cursor` for a list of `things` (plural, as the sentences say it), checked with a sentence on bad input. */
export const pageQueryFields = (things: string, size: { default: number; max: number }) => ({
  limit: z.coerce
    .number({ error: 'The page size must be a number.' })
    .int({ error: 'The page size must be a whole number.' })
    .min(1, { error: `Ask for at least one of the ${things} per page.` })
    .max(size.max, { error: `Ask for at most ${size.max} ${things} per page.` })
    .default(size.default),
  cursor: z.string().max(300, { error: PAGE_CURSOR_MESSAGE }).optional(),
});

/** What every paged answer carries beside its rows. */
export interface PageInfo {
  /** Pass back as `cursor` for the next page; null on the last one. */
  nextCursor: string | null;
  limit: number;
}
