// Thumbnail jobs (one per uploaded photo) and hourly housekeeping: orphan files, the 30-day purge,
// re-queuing thumbnails left pending. Each job is a thin call into a service.
import { defineWorker } from './workers.ts';
import { ensureThumbnailQueue, requestThumbnails, THUMBNAIL_QUEUE } from '../services/thumbnail-queue.ts';
import { makeThumbnail, stalePendingThumbnails } from '../services/thumbnails.ts';
import { thumbnailThreads } from '../services/thumbnail-pool.ts';
import { removeOrphanFiles } from '../services/orphan-cleanup.ts';
import { purgeDeletedSightings } from '../services/photo-purge.ts';

export const HOUSEKEEPING_QUEUE = 'photo-housekeeping';

export async function photoHousekeeping() {
  const orphans = await removeOrphanFiles();
  const purged = await purgeDeletedSightings();
  await requestThumbnails(await stalePendingThumbnails());
  return { orphansRemoved: orphans.removed.length, ...purged };
}

defineWorker({
  name: THUMBNAIL_QUEUE,
  async start(boss) {
    await ensureThumbnailQueue();
    // One batch per thread, so both cores decode at once.
    await boss.work<{ photoId: string }>(THUMBNAIL_QUEUE, { batchSize: Math.max(1, thumbnailThreads()), pollingIntervalSeconds: 0.5 }, async (jobs) => {
      await Promise.all(jobs.map((job) => makeThumbnail(job.data.photoId)));
    });
  },
});

defineWorker({
  name: HOUSEKEEPING_QUEUE,
  async start(boss) {
    await boss.createQueue(HOUSEKEEPING_QUEUE, { name: HOUSEKEEPING_QUEUE, policy: 'singleton' });
    await boss.schedule(HOUSEKEEPING_QUEUE, '17 * * * *');
    await boss.work(HOUSEKEEPING_QUEUE, async () => {
      await photoHousekeeping();
    });
    // At start-up too: a crash before this start may have left files behind.
    await photoHousekeeping().catch((error) => console.error('photo housekeeping failed:', (error as Error).message));
  },
});
