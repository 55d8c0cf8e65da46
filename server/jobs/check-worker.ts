// Heavy pattern checks run here, off the request: a thin call into the check runner.
import type PgBoss from 'pg-boss';
import { defineWorker } from './workers.ts';
import { createQueueOnce, queue } from './queue.ts';
import { runStoredCheck } from '../services/check-runner.ts';

export const CHECK_QUEUE = 'pattern-check';

interface CheckJob {
  checkId: string;
}

const created = new WeakMap<PgBoss, Promise<void>>();
function ensureQueue(boss: PgBoss) {
  if (!created.has(boss)) created.set(boss, createQueueOnce(boss, CHECK_QUEUE));
  return created.get(boss)!;
}

/** Queues a stored check; the runner marks it running, updates its progress and stores the result. */
export async function enqueueCheck(checkId: string) {
  const boss = await queue();
  await ensureQueue(boss);
  // The runner records failures on the check itself, so one retry covers only a worker that died mid-run.
  await boss.send(CHECK_QUEUE, { checkId } satisfies CheckJob, { retryLimit: 1, expireInMinutes: 30, singletonKey: checkId });
}

defineWorker({
  name: CHECK_QUEUE,
  async start(boss) {
    await ensureQueue(boss);
    await boss.work<CheckJob>(CHECK_QUEUE, async (jobs) => {
      for (const job of jobs) await runStoredCheck(job.data.checkId);
    });
  },
});
