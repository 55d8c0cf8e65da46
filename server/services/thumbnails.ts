// Makes and stores one photo's thumbnail; a photo that cannot be decoded is marked failed, its sighting kept.
import { findPhotoForThumbnail, listStalePendingThumbnails, markThumbnailFailed, markThumbnailReady } from '../queries/photos.ts';
import { photoStore, readStored, thumbnailKeyFor, writeStored } from './storage.ts';
import { renderInPool } from './thumbnail-pool.ts';

export type ThumbnailResult = { status: 'ready'; source: 'embedded' | 'decoded' } | { status: 'failed'; reason: string } | { status: 'skipped' };

export async function makeThumbnail(photoId: string): Promise<ThumbnailResult> {
  const photo = await findPhotoForThumbnail(photoId);
  if (!photo || photo.thumbnailStatus === 'ready') return { status: 'skipped' };
  // Orientation as read at upload: the thread does not parse the photo's EXIF a second time for it.
  const orientation = Number(photo.exif?.Orientation ?? 1) || 1;
  let rendered;
  try {
    // A local file is read by the render thread itself; an object is fetched here and handed over.
    const local = photoStore().localPath(photo.storageKey);
    rendered = await renderInPool(
      local ? { path: local, mimeType: photo.mimeType, orientation } : { bytes: await readStored(photo.storageKey), mimeType: photo.mimeType, orientation },
    );
  } catch (error) {
    const reason = (error as Error).message?.slice(0, 500) || 'The photo could not be decoded.';
    await markThumbnailFailed(photoId, reason);
    return { status: 'failed', reason };
  }
  const thumbnailKey = thumbnailKeyFor(photo.storageKey);
  await writeStored(thumbnailKey, rendered.bytes);
  await markThumbnailReady(photoId, thumbnailKey);
  return { status: 'ready', source: rendered.source };
}

/** Photos still pending well after upload (a lost job, a queue outage): their ids, for re-queuing. */
export async function stalePendingThumbnails(olderThanMinutes = 10) {
  return listStalePendingThumbnails(olderThanMinutes);
}
