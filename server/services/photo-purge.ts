// Deleted sightings stay recoverable for RECOVERABLE_DAYS; after that the rows and their photo files go.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { RECOVERABLE_DAYS } from './sightings.ts';
import { removeStored } from './storage.ts';

export async function purgeDeletedSightings(now = new Date()) {
  const cutoff = new Date(now.getTime() - RECOVERABLE_DAYS * 86_400_000);
  const files = await sequelize.transaction(async (transaction) => {
    const gone = await sequelize.query<{ photoId: string | null }>('DELETE FROM sightings WHERE deleted_at < :cutoff RETURNING photo_id AS "photoId"', {
      replacements: { cutoff },
      type: QueryTypes.SELECT,
      transaction,
    });
    const photoIds = [...new Set(gone.map((g) => g.photoId).filter((id): id is string => id !== null))];
    if (photoIds.length === 0) return { sightings: gone.length, keys: [] as string[] };
    // A photo still used by a live sighting (the same file in another field) stays.
    const removed = await sequelize.query<{ storageKey: string; thumbnailKey: string | null }>(
      `DELETE FROM photos ph WHERE ph.id IN (:photoIds) AND NOT EXISTS (SELECT 1 FROM sightings s WHERE s.photo_id = ph.id)
       RETURNING storage_key AS "storageKey", thumbnail_key AS "thumbnailKey"`,
      { replacements: { photoIds }, type: QueryTypes.SELECT, transaction },
    );
    return { sightings: gone.length, keys: removed.flatMap((r) => [r.storageKey, r.thumbnailKey].filter((k): k is string => !!k)) };
  });
  // Files go after the commit; one left behind by a failure here is an orphan the clean-up removes later.
  for (const key of files.keys) await removeStored(key).catch(() => {});
  return { sightings: files.sightings, files: files.keys.length };
}
