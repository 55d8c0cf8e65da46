// Deleted sightings stay recoverable for RECOVERABLE_DAYS; after that the rows and their photo files go.
import { sequelize } from '../db.ts';
import { RECOVERABLE_DAYS } from './sightings.ts';
import { removeStored } from './storage.ts';
import { purgeSightingsDeletedBefore } from '../queries/sightings.ts';
import { deleteUnheldPhotos } from '../queries/photos.ts';

export async function purgeDeletedSightings(now = new Date()) {
  const cutoff = new Date(now.getTime() - RECOVERABLE_DAYS * 86_400_000);
  const files = await sequelize.transaction(async (transaction) => {
    const gone = await purgeSightingsDeletedBefore(cutoff, { transaction });
    const photoIds = [...new Set(gone.map((g) => g.photoId).filter((id): id is string => id !== null))];
    if (photoIds.length === 0) return { sightings: gone.length, keys: [] as string[] };
    // A photo still used by a live sighting (the same file in another field) stays.
    const removed = await deleteUnheldPhotos(photoIds, { transaction });
    return { sightings: gone.length, keys: removed.flatMap((r) => [r.storageKey, r.thumbnailKey].filter((k): k is string => !!k)) };
  });
  // Files go after the commit; one left behind by a failure here is an orphan the clean-up removes later.
  for (const key of files.keys) await removeStored(key).catch(() => {});
  return { sightings: files.sightings, files: files.keys.length };
}
