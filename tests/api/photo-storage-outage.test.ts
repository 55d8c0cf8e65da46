// A photo that arrives while photo storage does not answer: nothing is kept, and the answer tells the phone to send it
// again later (not a refusal); sent again once storage is back, it is placed once.
import { vi, afterAll, describe, expect, it } from 'vitest';

const outage = await vi.hoisted(async () => {
  const { objectStoreOutage } = await import('../helpers/object-store-outage.ts');
  const made = await objectStoreOutage();
  // Before any server module reads its configuration: the S3 driver, pointed at a port nothing listens on yet.
  process.env.STORAGE_URL = made.storageUrl;
  Object.assign(process.env, made.credentials);
  return made;
});

import { config } from '../../server/config.ts';
import { makeJpeg, insideField, rowCounts, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';

afterAll(async () => {
  await closeThumbnailPool();
  await stopQueue();
  await outage.close();
});

describe('a photo sent while storage is down', () => {
  it('keeps nothing, answers that it should be sent again later, and places it once when storage is back', async () => {
    expect(config.storage.driver).toBe('s3');
    const { org, scout, pest } = await scoutingSetUp();
    const photo = { bytes: await makeJpeg({ gps: insideField(0.3, 0.6), markSeed: 17 }), name: 'leaf.jpg' };

    const down = await uploadPhotos(scout, [photo], { pestId: pest.id, clientIds: '["outage-1"]' }).expect(200);
    expect(down.body.results[0]).toMatchObject({ clientId: 'outage-1', outcome: 'retry' });
    expect(down.body.results[0].message).toMatch(/could not save this photo just now; nothing was kept/);
    expect(down.body.results[0].sightingId).toBeUndefined();
    expect(await rowCounts(org.id)).toMatchObject({ photos: 0, sightings: 0 });

    await outage.restore();
    const back = await uploadPhotos(scout, [photo], { pestId: pest.id, clientIds: '["outage-1"]' }).expect(200);
    expect(back.body.results[0]).toMatchObject({ clientId: 'outage-1', outcome: 'placed' });
    const again = await uploadPhotos(scout, [photo], { pestId: pest.id, clientIds: '["outage-1"]' }).expect(200);
    expect(again.body.results[0].outcome).toBe('duplicate');
    expect(await rowCounts(org.id)).toMatchObject({ photos: 1, sightings: 1 });
  });
});
