// The scout's upload queue as plain data: which photos go next, with which count, and what a reload leaves
// of the list. The hook (hooks/use-photo-uploads.ts) holds the files and sends them.
import type { PhotoOutcome } from '@shared/schemas/sightings.ts';

export type UploadState = 'ready' | 'sending' | 'sent' | 'failed';

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

/** A failure the scout can retry only while the file is still in memory and the fault was the network's or the server's. */
export const failed = (message: string, retryable: boolean): Partial<UploadEntry> => ({ state: 'failed', error: { message, retryable } });

/**
 * The list after a reload: the files themselves cannot be kept, so a photo that was on its way (or failed
 * and could have been retried) must be chosen again; a sent photo keeps its outcome.
 */
export function entriesAfterReload(saved: UploadEntry[]): UploadEntry[] {
  return saved.map((entry) =>
    entry.state === 'sending' || (entry.state === 'failed' && entry.error?.retryable)
      ? { ...entry, progress: 0, ...failed('The page was reloaded before this photo arrived; add it again to send it.', false) }
      : entry,
  );
}

/** Photos merely chosen are not worth keeping across a reload: their files are gone with the page. */
export const entriesWorthKeeping = (entries: UploadEntry[]) => entries.filter((e) => e.state !== 'ready');

/** Runs `work` over the queue in order, at most `parallel` at a time; resolves when every item is done. */
export async function drainQueue<T>(queue: readonly T[], parallel: number, work: (item: T) => Promise<void>): Promise<void> {
  const waiting = [...queue];
  const worker = async () => {
    for (let next = waiting.shift(); next !== undefined; next = waiting.shift()) await work(next);
  };
  await Promise.all(Array.from({ length: Math.min(parallel, waiting.length) }, worker));
}
