// The scout's upload queue: which photos go, with which count, how many at once, and what the outbox keeps across attempts and restarts.
import { describe, expect, it } from 'vitest';
import {
  countFor,
  afterAttempt,
  drainQueue,
  entriesToSend,
  outboxAfterRestart,
  outboxExpired,
  outboxToSend,
  readyEntry,
  sendResultOf,
  SENT_KEPT_MS,
  unsentCount,
  type OutboxItemState,
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
  const list = [entry('a'), entry('b', { state: 'sent' }), entry('c', { state: 'refused', error: { message: 'x', retryable: false } }), entry('d')];

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

const item = (clientId: string, change: Partial<OutboxItemState & { createdAt: number; sentAt: number }> = {}) => ({
  clientId,
  state: 'waiting' as const,
  attempts: 0,
  createdAt: 0,
  ...change,
});

describe('one attempt to send an outbox item', () => {
  it('keeps an item waiting when the server cannot be reached, counting the attempt and saying why', () => {
    const after = afterAttempt(item('a', { state: 'sending' }), { kind: 'unreachable', message: 'No connection.' });
    expect(after).toMatchObject({ state: 'waiting', attempts: 1, lastError: 'No connection.' });
  });

  it('marks it refused with the server’s own reason, so it is not sent again by itself', () => {
    const after = afterAttempt(item('a', { state: 'sending' }), { kind: 'refused', message: 'Your position lies outside North.' });
    expect(after).toMatchObject({ state: 'refused', refusal: 'Your position lies outside North.' });
    expect(outboxToSend([after])).toEqual([]);
  });

  it('keeps a photo the server kept nothing of on the phone as refused, with the server’s sentence', () => {
    const rejected = { fileName: 'notes.jpg', outcome: 'rejected' as const, message: 'This file is not a recognisable image, whatever its name says.' };
    const after = afterAttempt(item('a', { state: 'sending' }), sendResultOf(rejected));
    expect(after).toMatchObject({ state: 'refused', refusal: rejected.message, outcome: rejected });
    expect(outboxToSend([after])).toEqual([]);
    expect(afterAttempt(item('b', { state: 'sending' }), sendResultOf({ fileName: 'b.jpg', outcome: 'outside', message: 'Outside.' })).state).toBe('refused');
  });

  it('keeps a photo the server could not save just now waiting to be sent again, with the server’s sentence', () => {
    const notNow = { fileName: 'leaf.jpg', outcome: 'retry' as const, message: 'Patchwise could not save this photo just now; nothing was kept.' };
    const after = afterAttempt(item('a', { state: 'sending' }), sendResultOf(notNow));
    expect(after).toMatchObject({ state: 'waiting', attempts: 1, lastError: notNow.message });
    expect(after.refusal).toBeUndefined();
    expect(outboxToSend([after]).map((i) => i.clientId)).toEqual(['a']);
    expect(unsentCount([after])).toBe(1);
  });

  it('counts placed, needs-a-pin and already-sent photos as sent', () => {
    for (const outcome of ['placed', 'needs-pin', 'duplicate'] as const) {
      expect(afterAttempt(item('a', { state: 'sending' }), sendResultOf({ fileName: 'a.jpg', outcome, message: '' })).state).toBe('sent');
    }
  });

  it('marks it sent with its outcome and forgets an earlier network error', () => {
    const after = afterAttempt(item('a', { state: 'sending', lastError: 'No connection.', attempts: 2 }), { kind: 'sent' });
    expect(after).toMatchObject({ state: 'sent', attempts: 3, lastError: undefined });
  });
});

describe('the outbox after a reload or restart', () => {
  it('sends again an item that was on its way: whether it arrived is unknown, and the server records it once', () => {
    const restored = outboxAfterRestart([item('a', { state: 'sending' }), item('b', { state: 'sent' }), item('c', { state: 'refused' })]);
    expect(restored.map((i) => i.state)).toEqual(['waiting', 'sent', 'refused']);
  });

  it('drains the waiting items oldest first', () => {
    const items = [item('late', { createdAt: 30 }), item('sent', { state: 'sent', createdAt: 1 }), item('early', { createdAt: 10 })];
    expect(outboxToSend(items).map((i) => i.clientId)).toEqual(['early', 'late']);
  });

  it('counts what is still to go: waiting and on its way, not sent or refused', () => {
    expect(unsentCount([item('a'), item('b', { state: 'sending' }), item('c', { state: 'sent' }), item('d', { state: 'refused' })])).toBe(2);
  });

  it('lets a sent item leave the phone a day after it was sent, and nothing else', () => {
    const now = 10 * SENT_KEPT_MS;
    const items = [item('old', { state: 'sent', sentAt: now - SENT_KEPT_MS - 1 }), item('new', { state: 'sent', sentAt: now - 1 }), item('w', { sentAt: 0 })];
    expect(outboxExpired(items, now).map((i) => i.clientId)).toEqual(['old']);
  });
});
