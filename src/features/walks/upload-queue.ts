// The scout's upload queue as plain data: which photos go next, with which count, and what a reload or a
// restart leaves of the outbox (the photos and stops kept on the phone until they are sent; outbox/ stores and sends them).
import type { PhotoOutcome } from '@shared/schemas/sightings.ts';

/** ready: chosen, not yet sent; waiting: kept on the phone for the next connection; refused: the server said no, with its reason. */
export type UploadState = 'ready' | 'waiting' | 'sending' | 'sent' | 'refused';

export interface UploadEntry {
  clientId: string;
  fileName: string;
  sizeBytes: number;
  state: UploadState;
  /** 0..1 of the bytes on their way. */
  progress: number;
  /** Per-photo count typed by the scout; blank means "use the batch count". */
  count: string;
  outcome?: PhotoOutcome;
  error?: { message: string; retryable: boolean };
}

export interface BatchTags {
  pestId: string;
  /** The batch count; a per-photo count overrides it. */
  count: string;
}

export const readyEntry = (clientId: string, file: Pick<File, 'name' | 'size'>): UploadEntry => ({
  clientId,
  fileName: file.name,
  sizeBytes: file.size,
  state: 'ready',
  progress: 0,
  count: '',
});

/** The count sent with a photo: its own if typed, else the batch's, else none (presence only). */
export function countFor(entry: Pick<UploadEntry, 'count'>, batch: Pick<BatchTags, 'count'>): number | undefined {
  const text = entry.count.trim() || batch.count.trim();
  return text === '' ? undefined : Number(text);
}

/** What a press of "send" takes: the named photos (a retry), or every photo not yet sent or tried. */
export function entriesToSend(entries: UploadEntry[], only?: string[]): UploadEntry[] {
  return entries.filter((e) => (only ? only.includes(e.clientId) : e.state === 'ready'));
}

export const withChange = (entries: UploadEntry[], clientId: string, change: Partial<UploadEntry>) =>
  entries.map((e) => (e.clientId === clientId ? { ...e, ...change } : e));

/** What one attempt to send an outbox item came to. */
export type SendResult =
  | { kind: 'sent'; outcome?: PhotoOutcome }
  | { kind: 'refused'; message: string; outcome?: PhotoOutcome }
  /** No connection, a dropped one or a server fault: the item waits for the next try. */
  | { kind: 'unreachable'; message: string };

export interface OutboxItemState {
  clientId: string;
  state: Exclude<UploadState, 'ready'>;
  attempts: number;
  lastError?: string;
  refusal?: string;
  outcome?: PhotoOutcome;
}

/**
 * What the server's answer for one photo means for the phone: an outcome that kept nothing (outside the field, not a
 * photo) is a refusal that stays on the phone with its sentence; a fault on the server's side (`retry`) leaves the photo
 * waiting for the next try like a dropped connection; the others are sightings now.
 */
export function sendResultOf(outcome: PhotoOutcome): SendResult {
  if (outcome.outcome === 'retry') return { kind: 'unreachable', message: outcome.message };
  if (outcome.outcome === 'outside' || outcome.outcome === 'rejected') return { kind: 'refused', message: outcome.message, outcome };
  return { kind: 'sent', outcome };
}

/** The item after an attempt: sent and refused are final; an unreachable server leaves it waiting, one attempt more. */
export function afterAttempt<T extends OutboxItemState>(item: T, result: SendResult): T {
  const attempts = item.attempts + 1;
  switch (result.kind) {
    case 'sent':
      return { ...item, state: 'sent', attempts, outcome: result.outcome, lastError: undefined };
    case 'refused':
      return { ...item, state: 'refused', attempts, refusal: result.message, ...(result.outcome ? { outcome: result.outcome } : {}) };
    case 'unreachable':
      return { ...item, state: 'waiting', attempts, lastError: result.message };
  }
}

/**
 * The outbox after a reload or restart: an item that was on its way when the page went may or may not have arrived,
 * so it waits to be sent again (the server knows it by its client id or its content and records it once).
 */
export const outboxAfterRestart = <T extends OutboxItemState>(items: T[]): T[] =>
  items.map((item) => (item.state === 'sending' ? { ...item, state: 'waiting' } : item));

/** What a drain sends: everything waiting, oldest first. */
export const outboxToSend = <T extends OutboxItemState & { createdAt: number }>(items: T[]): T[] =>
  items.filter((item) => item.state === 'waiting').sort((a, b) => a.createdAt - b.createdAt);

/** Items still on the phone: waiting or on their way (a refused one is on the phone too, but needs the scout). */
export const unsentCount = (items: OutboxItemState[]) => items.filter((item) => item.state === 'waiting' || item.state === 'sending').length;

/** A sent item is kept this long so its outcome (placed, needs a pin) stays in view, then leaves the phone. */
export const SENT_KEPT_MS = 24 * 3_600_000;
export const outboxExpired = <T extends OutboxItemState & { sentAt?: number }>(items: T[], now: number): T[] =>
  items.filter((item) => item.state === 'sent' && item.sentAt !== undefined && now - item.sentAt > SENT_KEPT_MS);

/** Runs `work` over the queue in order, at most `parallel` at a time; resolves when every item is done. */
export async function drainQueue<T>(queue: readonly T[], parallel: number, work: (item: T) => Promise<void>): Promise<void> {
  const waiting = [...queue];
  const worker = async () => {
    for (let next = waiting.shift(); next !== undefined; next = waiting.shift()) await work(next);
  };
  await Promise.all(Array.from({ length: Math.min(parallel, waiting.length) }, worker));
}
