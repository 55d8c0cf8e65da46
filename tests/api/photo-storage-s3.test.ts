// The whole life of a photo with the S3 driver, against the local S3 fake the harness runs: upload, thumbnail,
// reading back through the app's access checks, purge and orphan clean-up, each checked in the bucket itself.
import { vi, afterAll, describe, expect, it } from 'vitest';

vi.hoisted(() => {
  // Before any server module reads its configuration.
  if (!process.env.TEST_S3_STORAGE_URL) throw new Error('TEST_S3_STORAGE_URL is not set: run this suite through `npm test`, which starts the S3 fake.');
  process.env.STORAGE_URL = process.env.TEST_S3_STORAGE_URL;
});

import crypto from 'node:crypto';
import request from 'supertest';
import { Jimp } from 'jimp';
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { createApp } from '../../server/app.ts';
import { config } from '../../server/config.ts';
import { sequelize } from '../../server/db.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadPhotos, uploadedFiles } from '../helpers/photos.ts';
import { makeThumbnail } from '../../server/services/thumbnails.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { purgeDeletedSightings } from '../../server/services/photo-purge.ts';
import { removeOrphanFiles } from '../../server/services/orphan-cleanup.ts';
import { newStorageKey } from '../../server/services/storage.ts';
import { s3Store } from '../../server/services/storage/s3-store.ts';

afterAll(async () => {
  await closeThumbnailPool();
});

const location = config.storage.driver === 's3' ? config.storage : null;
// A client of our own, so what the bucket holds is read without the code under test.
const bucket = new S3Client({ region: location!.region, endpoint: location!.endpoint!, forcePathStyle: true });
const Bucket = location!.bucket;

async function objectKeys(prefix: string) {
  const page = await bucket.send(new ListObjectsV2Command({ Bucket, Prefix: prefix }));
  return (page.Contents ?? []).map((o) => o.Key!).sort();
}
const objectBytes = async (Key: string) => Buffer.from(await (await bucket.send(new GetObjectCommand({ Bucket, Key }))).Body!.transformToByteArray());
const sha256 = (bytes: Uint8Array) => crypto.createHash('sha256').update(bytes).digest('hex');

describe('photos in S3-compatible storage', () => {
  it('uses the S3 driver in this suite and writes nothing to the upload folder', () => {
    expect(config.storage.driver).toBe('s3');
  });

  it('stores the upload as an object, makes its thumbnail there, serves both only through the access check, and purges both', async () => {
    const { org, scout, admin, pest } = await scoutingSetUp();
    const photo = await makeJpeg({ width: 640, height: 480, gps: insideField() });
    const res = await uploadPhotos(scout, [{ bytes: photo }], { pestId: pest.id }).expect(200);
    const { outcome, photoId, sightingId } = res.body.results[0];
    expect(outcome).toBe('placed');
    const [row] = await sequelize.query<{ storage_key: string; sha256: string }>('SELECT storage_key, sha256 FROM photos WHERE id = :photoId', {
      replacements: { photoId },
      type: 'SELECT' as never,
    });
    expect(await objectKeys(`${org.id}/`)).toEqual([row.storage_key]);
    expect(sha256(await objectBytes(row.storage_key))).toBe(sha256(photo));
    expect(row.sha256).toBe(sha256(photo));
    expect(uploadedFiles().filter((f) => f.startsWith(org.id))).toEqual([]);

    expect(await makeThumbnail(photoId)).toMatchObject({ status: 'ready' });
    const keys = await objectKeys(`${org.id}/`);
    expect(keys).toHaveLength(2);
    const thumbKey = keys.find((k) => k.endsWith('-thumb.jpg'))!;
    const stored = await Jimp.read(await objectBytes(thumbKey));
    expect(Math.max(stored.bitmap.width, stored.bitmap.height)).toBe(320);

    const original = await scout.get(`/api/photos/${photoId}/original`).buffer(true).expect(200);
    expect(sha256(original.body as Buffer)).toBe(sha256(photo));
    expect(original.headers['content-type']).toBe('image/jpeg');
    expect(original.headers['cache-control']).toBe('private, no-store');
    const thumb = await scout.get(`/api/photos/${photoId}/thumbnail`).buffer(true).expect(200);
    expect(sha256(thumb.body as Buffer)).toBe(sha256(await objectBytes(thumbKey)));

    const other = await makeOrganisation('Other');
    const outsider = await signedIn(other.users.admin.email);
    expect((await outsider.get(`/api/photos/${photoId}/original`)).status).toBe(404);
    expect((await request(createApp()).get(`/api/photos/${photoId}/original`)).status).toBe(401);

    await scout.delete(`/api/sightings/${sightingId}`).expect(204);
    await sequelize.query(`UPDATE sightings SET deleted_at = now() - interval '31 days' WHERE id = :sightingId`, { replacements: { sightingId } });
    const purged = await purgeDeletedSightings();
    expect(purged.files).toBeGreaterThanOrEqual(2);
    expect(await objectKeys(`${org.id}/`)).toEqual([]);
    expect((await admin.get(`/api/photos/${photoId}/original`)).status).toBe(404);
  });

  it('answers 404 with a sentence when the object has gone from the bucket', async () => {
    const { scout, pest } = await scoutingSetUp();
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField() }) }], { pestId: pest.id }).expect(200);
    const [row] = await sequelize.query<{ storage_key: string }>('SELECT storage_key FROM photos WHERE id = :id', {
      replacements: { id: res.body.results[0].photoId },
      type: 'SELECT' as never,
    });
    await bucket.send(new DeleteObjectCommand({ Bucket, Key: row.storage_key }));
    const gone = await scout.get(`/api/photos/${res.body.results[0].photoId}/original`);
    expect(gone.status).toBe(404);
    expect(gone.body.error.message).toMatch(/missing from storage/);
  });

  it('removes an object that no photo row names once the clean-up runs, keeping committed ones', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField() }) }], { pestId: pest.id }).expect(200);
    const committed = await objectKeys(`${org.id}/`);
    const orphanKey = newStorageKey(org.id, 'jpg');
    await bucket.send(new PutObjectCommand({ Bucket, Key: orphanKey, Body: await makeJpeg() }));
    const { removed } = await removeOrphanFiles({ graceMs: 0 });
    expect(removed).toContain(`s3://${Bucket}/${orphanKey}`);
    expect(await objectKeys(`${org.id}/`)).toEqual(committed);
  });

  it('is ready on /readyz while the bucket answers, and a store whose endpoint does not answer fails its check', async () => {
    const res = await request(createApp()).get('/readyz').expect(200);
    expect(res.body.checks.storage).toBe('ok');
    // Nothing listens on port 9 on loopback.
    const unreachable = s3Store({ ...location!, endpoint: 'http://127.0.0.1:9' }, () => true);
    await expect(unreachable.check()).rejects.toThrow();
  });
});
