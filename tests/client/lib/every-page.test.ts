import { describe, expect, it } from 'vitest';
import { fetchEveryPage } from '../../../src/lib/every-page.ts';

describe('reading a paged list whole', () => {
  it('follows each cursor until the server answers that no page follows, keeping the rows in order', async () => {
    const pages: Record<string, { rows: number[]; nextCursor: string | null }> = {
      first: { rows: [1, 2], nextCursor: 'b' },
      b: { rows: [3, 4], nextCursor: 'c' },
      c: { rows: [5], nextCursor: null },
    };
    const asked: Array<string | undefined> = [];
    const rows = await fetchEveryPage(
      async (cursor) => {
        asked.push(cursor);
        return { ...pages[cursor ?? 'first'], limit: 2 };
      },
      (page) => page.rows,
    );
    expect(rows).toEqual([1, 2, 3, 4, 5]);
    expect(asked).toEqual([undefined, 'b', 'c']);
  });

  it('passes on a failed page rather than answering part of the list', async () => {
    const failing = fetchEveryPage(
      async (cursor) => {
        if (cursor) throw new Error('The server answered 503');
        return { rows: [1], nextCursor: 'next', limit: 1 };
      },
      (page) => page.rows,
    );
    await expect(failing).rejects.toThrow('503');
  });
});
