// A worker killed with SIGKILL in the middle of a thumbnail job: pg-boss hands the job out again once it expires,
// another worker finishes it, and the photo ends with exactly one thumbnail file.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { makeJpeg, scoutingSetUp, uploadedFiles, uploadPhotos } from '../helpers/photos.ts';
import { killHard, reapChildren, startFixture, until } from './fixtures/child-processes.ts';

function startWorker(hang: 'before' | 'after' | null, marker: string) {
  return startFixture('thumbnail-worker.ts', { FAULT_HANG: hang ?? '', FAULT_MARKER: marker, THUMBNAIL_THREADS: '0', JOB_MAINTENANCE_SECONDS: '1' });
}

afterEach(reapChildren);

afterAll(async () => {
  await stopQueue();
});

describe('a thumbnail worker killed mid-job', () => {
  it.each(['before', 'after'] as const)('killed %s writing the thumbnail: the job is retried and the photo gets one thumbnail', async (hang) => {
    const { scout, field, pest } = await scoutingSetUp();
    const marker = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-fault-')), 'job');
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ width: 640, height: 480 }) }], { pestId: pest.id, fieldId: field.id }).expect(200);
    const photoId = res.body.results[0].photoId as string;

    const first = startWorker(hang, marker);
    const jobId = await until('the first worker to take the job', () => fs.existsSync(marker) && fs.readFileSync(marker, 'utf8'));
    await killHard(first);
    // Stands in for the 5 minutes after which pg-boss gives up on a silent worker.
    await sequelize.query(`UPDATE pgboss.job SET expire_in = interval '1 second' WHERE id = :jobId`, { replacements: { jobId } });

    startWorker(null, `${marker}-second`);
    const photo = await until('the thumbnail', async () => {
      const [row] = await sequelize.query<{ thumbnail_status: string; thumbnail_key: string | null; storage_key: string }>(
        'SELECT thumbnail_status, thumbnail_key, storage_key FROM photos WHERE id = :photoId',
        { replacements: { photoId }, type: QueryTypes.SELECT },
      );
      return row.thumbnail_status === 'ready' ? row : null;
    });
    const job = await until('the retried job to complete', async () => {
      const [row] = await sequelize.query<{ state: string; retry_count: number }>('SELECT state, retry_count FROM pgboss.job WHERE id = :jobId', {
        replacements: { jobId },
        type: QueryTypes.SELECT,
      });
      return row?.state === 'completed' ? row : null;
    });
    expect(job.retry_count).toBeGreaterThanOrEqual(1);

    const base = photo.storage_key.replace(/\.[a-z]+$/, '');
    const files = uploadedFiles()
      .map((f) => f.split(path.sep).join('/'))
      .filter((f) => f.startsWith(base));
    expect(files.sort()).toEqual([photo.storage_key, photo.thumbnail_key].sort());
    expect(uploadedFiles().filter((f) => path.basename(f).startsWith('.incoming-'))).toEqual([]);
    const thumb = await scout.get(`/api/photos/${photoId}/thumbnail`).expect(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
  });
});
