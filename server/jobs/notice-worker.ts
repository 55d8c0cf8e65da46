// Sends zone-notice copies from the queue; a thrown error makes pg-boss retry with the copy's back-off.
import { defineWorker } from './workers.ts';
import { createQueueOnce } from './queue.ts';
import { NOTICE_QUEUE } from '../services/notice-sending.ts';
import { deliverNoticeCopy } from '../services/notice-mail.ts';

defineWorker({
  name: NOTICE_QUEUE,
  async start(boss) {
    await createQueueOnce(boss, NOTICE_QUEUE);
    await boss.work<{ recipientId: string }>(NOTICE_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
      await deliverNoticeCopy(job.data.recipientId);
    });
  },
});
