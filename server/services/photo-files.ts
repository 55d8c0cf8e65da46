// Which stored file a person may fetch: only photos of sightings on fields they may see.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { AppError, notFound } from '../errors.ts';
import { visibleFieldIds } from './scope.ts';
import { storedPath } from './storage.ts';

export type PhotoVariant = 'original' | 'thumbnail';

export async function photoFileFor(actor: Actor, photoId: string, variant: PhotoVariant) {
  const ids = await visibleFieldIds(actor);
  const seesDeleted = actor.role === 'admin' || actor.role === 'adviser';
  const [photo] = await sequelize.query<{ storageKey: string; mimeType: string; thumbnailKey: string | null; thumbnailStatus: string }>(
    `SELECT ph.storage_key AS "storageKey", ph.mime_type AS "mimeType", ph.thumbnail_key AS "thumbnailKey", ph.thumbnail_status AS "thumbnailStatus"
       FROM photos ph
      WHERE ph.id = :photoId AND ph.organisation_id = :org
        AND EXISTS (SELECT 1 FROM sightings s WHERE s.photo_id = ph.id
                      ${ids ? (ids.length ? 'AND s.field_id IN (:ids)' : 'AND false') : ''}
                      ${seesDeleted ? '' : 'AND s.deleted_at IS NULL'})`,
    { replacements: { photoId, org: actor.organisationId, ids }, type: QueryTypes.SELECT },
  );
  if (!photo) throw notFound('That photo');
  if (variant === 'original') return { path: storedPath(photo.storageKey), mimeType: photo.mimeType };
  if (photo.thumbnailStatus !== 'ready' || !photo.thumbnailKey) {
    throw photo.thumbnailStatus === 'failed'
      ? new AppError(404, 'thumbnail_failed', 'No thumbnail could be made from this photo; open the original instead.')
      : new AppError(404, 'thumbnail_pending', 'The thumbnail is still being made; try again in a few seconds.');
  }
  return { path: storedPath(photo.thumbnailKey), mimeType: 'image/jpeg' };
}
