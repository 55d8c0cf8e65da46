// The scout's upload queue: which photos go, with which count, how many at once, and what a reload keeps.
import { describe, expect, it } from 'vitest';
import {
  countFor,
  drainQueue,
  entriesAfterReload,
  entriesToSend,
  entriesWorthKeeping,
  readyEntry,
  withChange,
  type UploadEntry,
} from '../../../src/features/walks/upload-queue.ts';

const entry = (clientId: string, change: Partial<UploadEntry> = {}): UploadEntry => ({
  ...readyEntry(clientId, { name: `${clientId}.jpg`, size: 2_000_000 }),
  ...change,
});

describe('the count sent with a photo', () => {
  it('is the photo’s own count when the scout typed one', () => {
    expect(countFor({ count: '3' }, { count: '5' })).toBe(3);
  });

  it('falls back to the batch count', () => {
    expect(countFor({ count: '' }, { count: '5' })).toBe(5);
    expect(countFor({ count: '   ' }, { count: ' 5 ' })).toBe(5);
  });

  it('is none at all (presence only) when neither is typed, never 0, which would mean "nothing found"', () => {
    expect(countFor({ count: '' }, { count: '' })).toBeUndefined();
  });

  it('keeps an explicit 0 typed for the photo', () => {
    expect(countFor({ count: '0' }, { count: '5' })).toBe(0);
  });
});

describe('a press of send', () => {
  const list = [entry('a'), entry('b', { state: 'sent' }), entry('c', { state: 'failed', error: { message: 'x', retryable: true } }), entry('d')];

  it('takes every photo that is ready, in the order chosen', () => {
    expect(entriesToSend(list).map((e) => e.clientId)).toEqual(['a', 'd']);
  });

  it('takes only the named photo on a retry', () => {
    expect(entriesToSend(list, ['c']).map((e) => e.clientId)).toEqual(['c']);
  });
});

describe('sending a few at a time', () => {
  it('never has more than two photos on their way, and sends every one', async () => {
    let inFlight = 0;
    let most = 0;
    const sent: string[] = [];
    const work = async (id: string) => {
      inFlight += 1;
      most = Math.max(most, inFlight);
      await new Promise((resolve) => setTimeout(resolve, id === 'p1' ? 15 : 5));
      inFlight -= 1;
      sent.push(id);
    };
    await drainQueue(['p1', 'p2', 'p3', 'p4', 'p5'], 2, work);
    expect(most).toBe(2);
    expect([...sent].sort()).toEqual(['p1', 'p2', 'p3', 'p4', 'p5']);
  });

  it('starts the photos in the order they were chosen', async () => {
    const started: string[] = [];
    await drainQueue(['p1', 'p2', 'p3'], 2, async (id) => {
      started.push(id);
      await Promise.resolve();
    });
    expect(started).toEqual(['p1', 'p2', 'p3']);
  });

  it('finishes at once with nothing to send', async () => {
    let calls = 0;
    await drainQueue([], 2, async () => {
      calls += 1;
    });
    expect(calls).toBe(0);
  });
});

describe('one photo’s progress', () => {
  it('changes only that photo', () => {
    const list = [entry('a'), entry('b')];
    const after = withChange(list, 'b', { state: 'sending', progress: 0.4 });
    expect(after[0]).toBe(list[0]);
    expect(after[1]).toMatchObject({ state: 'sending', progress: 0.4 });
  });
});

describe('after a reload', () => {
  it('marks a photo that was on its way as to be added again: its file is gone with the page', () => {
    const [after] = entriesAfterReload([entry('a', { state: 'sending', progress: 0.6 })]);
    expect(after).toMatchObject({ state: 'failed', progress: 0, error: { retryable: false } });
    expect(after.error?.message).toMatch(/add it again/);
  });

  it('does the same for a failed photo that could have been retried', () => {
    const [after] = entriesAfterReload([entry('a', { state: 'failed', error: { message: 'The connection dropped.', retryable: true } })]);
    expect(after.error).toMatchObject({ retryable: false });
  });

  it('keeps a refused photo’s own reason (a retry would be refused again)', () => {
    const refused = entry('a', { state: 'failed', error: { message: 'This file is not a JPEG.', retryable: false } });
    expect(entriesAfterReload([refused])).toEqual([refused]);
  });

  it('keeps a sent photo as sent', () => {
    const sent = entry('a', { state: 'sent', progress: 1 });
    expect(entriesAfterReload([sent])).toEqual([sent]);
  });
});

describe('what is kept for a reload', () => {
  it('is everything but the photos merely chosen', () => {
    const list = [entry('a'), entry('b', { state: 'sent' }), entry('c', { state: 'sending' }), entry('d', { state: 'failed' })];
    expect(entriesWorthKeeping(list).map((e) => e.clientId)).toEqual(['b', 'c', 'd']);
  });
});
