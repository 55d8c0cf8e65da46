// A paged list read whole: for screens that need every row at once (the review's map, statistics and table).
import type { PageInfo } from '@shared/schemas/page.ts';

/** Asks for page after page, each from the last one's cursor, until the server answers that none follows. */
export async function fetchEveryPage<Page extends PageInfo, Row>(fetchPage: (cursor: string | undefined) => Promise<Page>, rowsOf: (page: Page) => Row[]) {
  const rows: Row[] = [];
  let cursor: string | undefined;
  do {
    const page = await fetchPage(cursor);
    rows.push(...rowsOf(page));
    cursor = page.nextCursor ?? undefined;
  } while (cursor);
  return rows;
}
