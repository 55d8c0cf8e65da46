// Which stored file a person may fetch: only photos of sightings on fields they may see.
import { findPhotoFileOfSightings } from '../queries/photos.ts';
import type { Actor } from '../auth/passport.ts';
import { AppError, notFound } from '../errors.ts';
import { visibleFieldIds } from './scope.ts';

export type PhotoVariant = 'original' | 'thumbnail';

export async function photoFileFor(actor: Actor, photoId: string, variant: PhotoVariant) {
  const ids = await visibleFieldIds(actor);
  const seesDeleted = actor.role === 'admin' || actor.role === 'adviser';
  const photo = await findPhotoFileOfSightings(actor.organisationId, photoId, ids, seesDeleted);
  if (!photo) throw notFound('That photo');
  if (variant === 'original') return { key: photo.storageKey, mimeType: photo.mimeType };
  if (photo.thumbnailStatus !== 'ready' || !photo.thumbnailKey) {
    throw photo.thumbnailStatus === 'failed'
      ? new AppError(404, 'thumbnail_failed', 'No thumbnail could be made from this photo; open the original instead.')
      : new AppError(404, 'thumbnail_pending', 'The thumbnail is still being made; try again in a few seconds.');
  }
  return { key: photo.thumbnailKey, mimeType: 'image/jpeg' };
}
