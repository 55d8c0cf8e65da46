// Makes and stores one photo's thumbnail; a photo that cannot be decoded is marked failed, its sighting kept.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { storedPath, thumbnailKeyFor, writeStored } from './storage.ts';
import { renderInPool } from './thumbnail-pool.ts';

export type ThumbnailResult = { status: 'ready'; source: 'embedded' | 'decoded' } | { status: 'failed'; reason: string } | { status: 'skipped' };

export async function makeThumbnail(photoId: string): Promise<ThumbnailResult> {
  const [photo] = await sequelize.query<{ storageKey: string; mimeType: string; exif: Record<string, unknown>; thumbnailStatus: string }>(
    'SELECT storage_key AS "storageKey", mime_type AS "mimeType", exif, thumbnail_status AS "thumbnailStatus" FROM photos WHERE id = :photoId',
    { replacements: { photoId }, type: QueryTypes.SELECT },
  );
  if (!photo || photo.thumbnailStatus === 'ready') return { status: 'skipped' };
  // Orientation as read at upload: the thread does not parse the photo's EXIF a second time for it.
  const orientation = Number(photo.exif?.Orientation ?? 1) || 1;
  let rendered;
  try {
    rendered = await renderInPool({ path: storedPath(photo.storageKey), mimeType: photo.mimeType, orientation });
  } catch (error) {
    const reason = (error as Error).message?.slice(0, 500) || 'The photo could not be decoded.';
    await sequelize.query(`UPDATE photos SET thumbnail_status = 'failed', thumbnail_error = :reason, updated_at = now() WHERE id = :photoId`, {
      replacements: { photoId, reason },
    });
    return { status: 'failed', reason };
  }
  const thumbnailKey = thumbnailKeyFor(photo.storageKey);
  await writeStored(thumbnailKey, rendered.bytes);
  await sequelize.query(
    `UPDATE photos SET thumbnail_status = 'ready', thumbnail_key = :thumbnailKey, thumbnail_error = NULL, updated_at = now() WHERE id = :photoId`,
    {
      replacements: { photoId, thumbnailKey },
    },
  );
  return { status: 'ready', source: rendered.source };
}

/** Photos still pending well after upload (a lost job, a queue outage): their ids, for re-queuing. */
export async function stalePendingThumbnails(olderThanMinutes = 10) {
  const rows = await sequelize.query<{ id: string }>(
    `SELECT id FROM photos WHERE thumbnail_status = 'pending' AND created_at < now() - make_interval(mins => :olderThanMinutes) LIMIT 500`,
    { replacements: { olderThanMinutes }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.id);
}
