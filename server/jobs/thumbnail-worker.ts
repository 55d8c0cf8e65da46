// Thumbnail jobs (one per uploaded photo) and hourly housekeeping: orphan files, the 30-day purge,
// re-queuing thumbnails left pending. Each job is a thin call into a service.
import { defineWorker } from './workers.ts';
import { createQueueOnce } from './queue.ts';
import { ensureThumbnailQueue, requestThumbnails, THUMBNAIL_QUEUE, thumbnailWorkerStarted } from '../services/thumbnail-queue.ts';
import { makeThumbnail, stalePendingThumbnails } from '../services/thumbnails.ts';
import { thumbnailThreads } from '../services/thumbnail-pool.ts';
import { removeOrphanFiles } from '../services/orphan-cleanup.ts';
import { purgeDeletedSightings } from '../services/photo-purge.ts';
import { logger } from '../logger.ts';

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
    // pg-boss fetches a batch, waits for all of it, then sleeps out the rest of its polling interval. Several jobs
    // per thread keep both threads fed (the pool queues them), and two loops let one fetch while the other's last
    // job finishes; queuing wakes them (thumbnailWorkerStarted) so a fresh upload does not wait for the next poll.
    const options = { batchSize: Math.max(1, thumbnailThreads()) * 4, pollingIntervalSeconds: 0.5 };
    for (let loop = 0; loop < 2; loop++) {
      const workerId = await boss.work<{ photoId: string }>(THUMBNAIL_QUEUE, options, async (jobs) => {
        await Promise.all(jobs.map((job) => makeThumbnail(job.data.photoId)));
      });
      thumbnailWorkerStarted(workerId);
    }
  },
});

defineWorker({
  name: HOUSEKEEPING_QUEUE,
  async start(boss) {
    await createQueueOnce(boss, HOUSEKEEPING_QUEUE, { name: HOUSEKEEPING_QUEUE, policy: 'singleton' });
    await boss.schedule(HOUSEKEEPING_QUEUE, '17 * * * *');
    await boss.work(HOUSEKEEPING_QUEUE, async () => {
      await photoHousekeeping();
    });
    // At start-up too: a crash before this start may have left files behind.
    await photoHousekeeping().catch((error) => logger.error({ err: error }, 'photo housekeeping failed'));
  },
});
