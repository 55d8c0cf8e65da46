// The per-walk upload list kept in sessionStorage, so a reload or a dropped tab loses nothing already sent.
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

const storageKey = (scope: string) => `patchwise.uploads.${scope}`;

export function loadEntries(scope: string): UploadEntry[] {
  try {
    const saved = JSON.parse(sessionStorage.getItem(storageKey(scope)) ?? '[]') as UploadEntry[];
    // The files themselves cannot be kept; what was mid-way must be chosen again.
    return saved.map((entry) =>
      entry.state === 'sending' || (entry.state === 'failed' && entry.error?.retryable)
        ? { ...entry, state: 'failed', progress: 0, error: { message: 'The page was reloaded before this photo arrived; add it again to send it.', retryable: false } }
        : entry,
    );
  } catch {
    return [];
  }
}

export function saveEntries(scope: string, entries: UploadEntry[]) {
  const worthKeeping = entries.filter((e) => e.state !== 'ready');
  try {
    if (worthKeeping.length) sessionStorage.setItem(storageKey(scope), JSON.stringify(worthKeeping));
    else sessionStorage.removeItem(storageKey(scope));
  } catch {
    // Storage full or disabled (private mode): the list still lives in memory.
  }
}

export function newClientId() {
  // randomUUID exists only in secure contexts; a phone on the office Wi-Fi over plain http still needs an id.
  return globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}
