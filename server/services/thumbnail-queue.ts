// Hands photos to the thumbnail worker through the PostgreSQL-backed queue (pg-boss).
import { queue } from '../jobs/queue.ts';

export const THUMBNAIL_QUEUE = 'photo-thumbnail';
let created: Promise<void> | null = null;

export async function ensureThumbnailQueue() {
  const boss = await queue();
  created ??= boss.createQueue(THUMBNAIL_QUEUE, { name: THUMBNAIL_QUEUE, retryLimit: 2, retryDelay: 5, expireInSeconds: 300 }).catch((error) => {
    created = null;
    throw error;
  });
  await created;
  return boss;
}

/** Queues thumbnails; a failure here only delays them (housekeeping re-queues photos left pending). */
export async function requestThumbnails(photoIds: string[]) {
  if (photoIds.length === 0) return;
  try {
    const boss = await ensureThumbnailQueue();
    for (const photoId of photoIds) await boss.send(THUMBNAIL_QUEUE, { photoId });
  } catch (error) {
    console.error('thumbnail jobs not queued:', (error as Error).message);
  }
}

