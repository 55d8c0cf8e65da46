// The per-walk upload list kept in sessionStorage, so a reload or a dropped tab loses nothing already sent.
import { entriesAfterReload, entriesWorthKeeping, type UploadEntry } from '../upload-queue.ts';

const storageKey = (scope: string) => `patchwise.uploads.${scope}`;

export function loadEntries(scope: string): UploadEntry[] {
  try {
    return entriesAfterReload(JSON.parse(sessionStorage.getItem(storageKey(scope)) ?? '[]') as UploadEntry[]);
  } catch {
    return [];
  }
}

export function saveEntries(scope: string, entries: UploadEntry[]) {
  const worthKeeping = entriesWorthKeeping(entries);
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
