// A photo whose decoded size would pass the stated pixel limit is refused from its headers, before any decoding,
// with a sentence that gives its size and the limit; nothing is stored.
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { insideField, makeJpeg, rowCounts, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';

afterEach(() => {
  delete process.env.PHOTO_MAX_MEGAPIXELS;
});
afterAll(async () => {
  await stopQueue();
  await closeThumbnailPool();
});

describe('the pixel limit', () => {
  it('refuses a photo larger than the limit with its size in the sentence and keeps nothing', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const photo = await makeJpeg({ gps: insideField(), width: 640, height: 480 });
    const before = await rowCounts(org.id);
    // 640 × 480 = 307,200 pixels against a limit of 0.2 MP.
    process.env.PHOTO_MAX_MEGAPIXELS = '0.2';
    const res = await uploadPhotos(scout, [{ bytes: photo }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('rejected');
    expect(res.body.results[0].message).toBe(
      'This photo is 640 × 480 pixels (0.3 MP); Patchwise takes photos of at most 0.2 MP. Send a smaller copy (phones can share a reduced size).',
    );
    expect(await rowCounts(org.id)).toEqual(before);
  });

  it('takes the same photo under the default limit', async () => {
    const { scout, pest } = await scoutingSetUp();
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField(), width: 640, height: 480 }) }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('placed');
  });
});
