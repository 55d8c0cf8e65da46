// Jobs queued on a transaction commit and roll back with it (what keeps a notice's copies and their jobs together).
import { afterAll, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { createQueueOnce, queue, stopQueue } from '../../server/jobs/queue.ts';
import { jobsInTransaction } from '../../server/queries/job-queue.ts';

const QUEUE = 'transaction-test';

afterAll(async () => {
  await stopQueue();
});

const jobsFor = async (marker: string) =>
  sequelize.query<{ id: string }>(`SELECT id FROM pgboss.job WHERE name = :name AND data->>'marker' = :marker`, {
    replacements: { name: QUEUE, marker },
    type: QueryTypes.SELECT,
  });

describe('a job queued on a transaction', () => {
  it('is there once the transaction commits', async () => {
    const boss = await queue();
    await createQueueOnce(boss, QUEUE);
    const marker = crypto.randomUUID();
    await sequelize.transaction(async (transaction) => {
      await boss.send(QUEUE, { marker }, { retryLimit: 5, retryDelay: 60, retryBackoff: true, db: jobsInTransaction(transaction) });
      // Not yet visible to anyone else: the job waits for the rows it belongs to.
      expect(await jobsFor(marker)).toHaveLength(0);
    });
    expect(await jobsFor(marker)).toHaveLength(1);
  });

  it('is gone when the transaction rolls back', async () => {
    const boss = await queue();
    await createQueueOnce(boss, QUEUE);
    const marker = crypto.randomUUID();
    await expect(
      sequelize.transaction(async (transaction) => {
        await boss.send(QUEUE, { marker }, { db: jobsInTransaction(transaction) });
        throw new Error('the rows could not be stored');
      }),
    ).rejects.toThrow('the rows could not be stored');
    expect(await jobsFor(marker)).toHaveLength(0);
  });
});
