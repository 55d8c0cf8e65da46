import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

export interface NewPhoto {
  org: string;
  userId: string;
  sha256: string;
  storageKey: string;
  mimeType: string;
  byteSize: number;
  originalName: string;
  /** The kept EXIF tags, as JSON text. */
  exif: string;
}

export const insertPhoto = async (photo: NewPhoto, options: InTransaction = {}) =>
  (await selectRow<{ id: string }>(
    `INSERT INTO photos (organisation_id, uploaded_by, sha256, storage_key, mime_type, byte_size, original_name, exif)
         VALUES (:org, :userId, :sha256, :storageKey, :mimeType, :byteSize, :originalName, CAST(:exif AS jsonb)) RETURNING id`,
    { ...photo },
    options,
  ))!.id;

export const markPhotoDeleted = (photoId: string, options: InTransaction = {}) =>
  execute('UPDATE photos SET deleted_at = now(), updated_at = now() WHERE id = :photoId', { photoId }, options);

export const markPhotoRestored = (photoId: string, options: InTransaction = {}) =>
  execute('UPDATE photos SET deleted_at = NULL, updated_at = now() WHERE id = :photoId', { photoId }, options);

/** Removes those of the photos no sighting holds any more; the keys of their files. */
export const deleteUnheldPhotos = (photoIds: string[], options: InTransaction = {}) =>
  selectRows<{ storageKey: string; thumbnailKey: string | null }>(
    `DELETE FROM photos ph WHERE ph.id IN (:photoIds) AND NOT EXISTS (SELECT 1 FROM sightings s WHERE s.photo_id = ph.id)
       RETURNING storage_key AS "storageKey", thumbnail_key AS "thumbnailKey"`,
    { photoIds },
    options,
  );

export interface PhotoFileRow {
  storageKey: string;
  mimeType: string;
  thumbnailKey: string | null;
  thumbnailStatus: string;
}

/**
 * The organisation's photo, if a sighting holds it on one of the fields in `ids` (any field when null); a deleted
 * sighting counts only when `withDeleted`.
 */
export const findPhotoFileOfSightings = (organisationId: string, photoId: string, ids: string[] | null, withDeleted: boolean) =>
  selectRow<PhotoFileRow>(
    `SELECT ph.storage_key AS "storageKey", ph.mime_type AS "mimeType", ph.thumbnail_key AS "thumbnailKey", ph.thumbnail_status AS "thumbnailStatus"
       FROM photos ph
      WHERE ph.id = :photoId AND ph.organisation_id = :org
        AND EXISTS (SELECT 1 FROM sightings s WHERE s.photo_id = ph.id
                      ${ids ? (ids.length ? 'AND s.field_id IN (:ids)' : 'AND false') : ''}
                      ${withDeleted ? '' : 'AND s.deleted_at IS NULL'})`,
    { photoId, org: organisationId, ids },
  );

/** Which of these file keys a photo row names (as its original or its thumbnail). */
export const findKnownFileKeys = async (keys: string[]) =>
  (
    await selectRows<{ key: string }>(
      `SELECT storage_key AS key FROM photos WHERE storage_key IN (:keys) UNION SELECT thumbnail_key FROM photos WHERE thumbnail_key IN (:keys)`,
      { keys },
    )
  ).map((r) => r.key);

export const findPhotoForThumbnail = (photoId: string) =>
  selectRow<{ storageKey: string; mimeType: string; exif: Record<string, unknown>; thumbnailStatus: string }>(
    'SELECT storage_key AS "storageKey", mime_type AS "mimeType", exif, thumbnail_status AS "thumbnailStatus" FROM photos WHERE id = :photoId',
    { photoId },
  );

export const markThumbnailFailed = (photoId: string, reason: string) =>
  execute(`UPDATE photos SET thumbnail_status = 'failed', thumbnail_error = :reason, updated_at = now() WHERE id = :photoId`, { photoId, reason });

export const markThumbnailReady = (photoId: string, thumbnailKey: string) =>
  execute(`UPDATE photos SET thumbnail_status = 'ready', thumbnail_key = :thumbnailKey, thumbnail_error = NULL, updated_at = now() WHERE id = :photoId`, {
    photoId,
    thumbnailKey,
  });

/** Photos whose thumbnail is still pending this long after upload (at most 500). */
export const listStalePendingThumbnails = async (olderThanMinutes: number) =>
  (
    await selectRows<{ id: string }>(
      `SELECT id FROM photos WHERE thumbnail_status = 'pending' AND created_at < now() - make_interval(mins => :olderThanMinutes) LIMIT 500`,
      { olderThanMinutes },
    )
  ).map((r) => r.id);

/** Of these photos, the ones whose thumbnail is still to be made. */
export const photosAwaitingThumbnail = async (photoIds: string[]) =>
  photoIds.length === 0
    ? []
    : (
        await selectRows<{ id: string }>(`SELECT id FROM photos WHERE id = ANY(CAST(:photoIds AS uuid[])) AND thumbnail_status = 'pending'`, {
          photoIds: `{${photoIds.join(',')}}`,
        })
      ).map((r) => r.id);
