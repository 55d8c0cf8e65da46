// Hands photos to the thumbnail worker through the PostgreSQL-backed queue (pg-boss).
import { createQueueOnce, queue } from '../jobs/queue.ts';
import { logger } from '../logger.ts';

export const THUMBNAIL_QUEUE = 'photo-thumbnail';
let created: Promise<void> | null = null;
/** Thumbnail workers polling in this process: woken when photos are queued, rather than at their next poll. */
const localWorkers = new Set<string>();

export const thumbnailWorkerStarted = (workerId: string) => void localWorkers.add(workerId);

export async function ensureThumbnailQueue() {
  const boss = await queue();
  created ??= createQueueOnce(boss, THUMBNAIL_QUEUE, { name: THUMBNAIL_QUEUE, retryLimit: 2, retryDelay: 5, expireInSeconds: 300 }).catch((error) => {
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
    // One insert for the batch; retry and expiry come from the queue's settings.
    await boss.insert(photoIds.map((photoId) => ({ name: THUMBNAIL_QUEUE, data: { photoId } })));
    for (const workerId of localWorkers) boss.notifyWorker(workerId);
  } catch (error) {
    logger.error({ err: error }, 'thumbnail jobs not queued');
  }
}
