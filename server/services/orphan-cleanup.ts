// Removes files that no committed photo row names: left by a crash between the file write and the commit,
// or by a temp file whose rename never happened. Files younger than the grace period may still be mid-upload.
import { findKnownFileKeys } from '../queries/photos.ts';
import { listStoredFiles, removeListedFile } from './storage.ts';

export const ORPHAN_GRACE_MS = 15 * 60_000;

export async function removeOrphanFiles(options: { graceMs?: number; now?: Date } = {}) {
  const graceMs = options.graceMs ?? ORPHAN_GRACE_MS;
  const now = options.now ?? new Date();
  const files = await listStoredFiles();
  const candidates = files.filter((f) => now.getTime() - f.modifiedAt.getTime() >= graceMs);
  if (candidates.length === 0) return { removed: [] as string[] };
  const keys = candidates.map((f) => f.key).filter((k): k is string => k !== null);
  const known = new Set(keys.length ? await findKnownFileKeys(keys) : []);
  const removed: string[] = [];
  for (const file of candidates) {
    if (file.key && known.has(file.key)) continue;
    await removeListedFile(file);
    removed.push(file.path);
  }
  return { removed };
}
