import { afterAll, describe, expect, it } from 'vitest';
import exifReader from 'exif-reader';
import { Jimp } from 'jimp';
import fs from 'node:fs';
import path from 'node:path';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import {
  app1Exif,
  fromDmsRationals,
  insideField,
  makeJpeg,
  rowCounts,
  scoutingSetUp,
  SOUTH_WEST_ORIGIN,
  toDmsRationals,
  uploadedFiles,
  uploadPhotos,
  withExif,
} from '../helpers/photos.ts';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { startWorkers } from '../../server/jobs/workers.ts';
import '../../server/jobs/thumbnail-worker.ts';
import { makeThumbnail } from '../../server/services/thumbnails.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { newStorageKey, storedPath, writeStored } from '../../server/services/storage.ts';
import { removeOrphanFiles } from '../../server/services/orphan-cleanup.ts';

afterAll(async () => {
  await stopQueue();
  await closeThumbnailPool();
});

/** What a reader following EXIF 2.32 §4.6.6 must return: DMS to decimal, negative for S and W. */
const signed = (dms: ReturnType<typeof toDmsRationals>, ref: string) => (ref === 'S' || ref === 'W' ? -1 : 1) * fromDmsRationals(dms);

describe('photos with EXIF GPS become sightings', () => {
  it('places photos with S and W references at exactly their EXIF coordinates, agreeing with exif-reader', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const spots = [insideField(0.2, 0.3), insideField(0.7, 0.8), insideField(0.5, 0.1)];
    const photos = await Promise.all(
      spots.map((p, i) =>
        makeJpeg({
          gps: { ...p, altitudeM: 23.5 + i, accuracyM: 3.5, directionDeg: 90 + i },
          dateTimeOriginal: '2026:11:20 10:15:00',
          offsetTimeOriginal: '-03:00',
        }),
      ),
    );
    const res = await uploadPhotos(
      scout,
      photos.map((bytes) => ({ bytes })),
      { pestId: pest.id, counts: JSON.stringify([3, 0, 12]), clientIds: JSON.stringify(['a', 'b', 'c']) },
    ).expect(200);

    expect(res.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['placed', 'placed', 'placed']);
    expect(res.body.results.map((r: { clientId: string }) => r.clientId)).toEqual(['a', 'b', 'c']);
    expect(new Set(res.body.results.map((r: { walkId: string }) => r.walkId)).size).toBe(1);
    const list = await scout.get(`/api/sightings?walkId=${res.body.results[0].walkId}`).expect(200);
    for (const [i, result] of res.body.results.entries()) {
      const sighting = list.body.sightings.find((s: { id: string }) => s.id === result.sightingId);
      // Expected: the DMS rationals written into the file, with the sign from the S/W references.
      const expectedLat = signed(toDmsRationals(spots[i].lat), 'S');
      const expectedLon = signed(toDmsRationals(spots[i].lon), 'W');
      expect(sighting.position.lat).toBeCloseTo(expectedLat, 10);
      expect(sighting.position.lon).toBeCloseTo(expectedLon, 10);
      expect(sighting.position.lat).toBeLessThan(0);
      expect(sighting.position.lon).toBeLessThan(0);
      // Second reader: exif-reader on the same APP1 segment, signs applied from its refs.
      const gps = exifReader(app1Exif(photos[i])!).GPSInfo!;
      const dms = (v: number[]) => v[0] + v[1] / 60 + v[2] / 3600;
      expect(sighting.position.lat).toBeCloseTo((gps.GPSLatitudeRef === 'S' ? -1 : 1) * dms(gps.GPSLatitude as number[]), 10);
      expect(sighting.position.lon).toBeCloseTo((gps.GPSLongitudeRef === 'W' ? -1 : 1) * dms(gps.GPSLongitude as number[]), 10);
      expect(sighting).toMatchObject({
        fieldId: field.id,
        positionSource: 'exif',
        status: 'placed',
        accuracyM: 3.5,
        altitudeM: 23.5 + i,
        directionDeg: 90 + i,
        timeFlag: null,
        count: [3, 0, 12][i],
      });
      // 10:15 at UTC−03:00 is 13:15 UTC.
      expect(sighting.observedAt).toBe('2026-11-20T13:15:00.000Z');
      expect(sighting.walkedOn).toBe('2026-11-20');
    }
  });

  it('serves the original bytes with their type to the organisation, and to nobody else', async () => {
    const { scout, admin, pest } = await scoutingSetUp();
    const bytes = await makeJpeg({ gps: insideField() });
    const res = await uploadPhotos(scout, [{ bytes }], { pestId: pest.id }).expect(200);
    const { photoId } = res.body.results[0];
    const original = await admin.get(`/api/photos/${photoId}/original`).buffer(true).expect(200);
    expect(original.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(original.body as Buffer, bytes)).toBe(0);
    // A private picture is kept in no cache, so nobody sees it after sign-out (RFC 9111 §5.2.2.5 no-store, §5.2.2.7 private).
    expect(original.headers['cache-control']).toBe('private, no-store');

    const stranger = await makeOrganisation('Other');
    const outsider = await signedIn(stranger.users.adviser.email);
    const refused = await outsider.get(`/api/photos/${photoId}/original`);
    expect(refused.status).toBe(404);
    expect((await outsider.get(`/api/photos/${photoId}/thumbnail`)).status).toBe(404);
    expect((await outsider.get(`/api/walks/${res.body.results[0].walkId}`)).status).toBe(404);
  });
});

describe('bad inputs get a clear outcome and leave nothing behind', () => {
  const cases: Array<{ name: string; photo: () => Promise<{ bytes: Buffer; name?: string }>; outcome: string; message: RegExp }> = [
    {
      name: 'a non-image with a .jpg name',
      photo: async () => ({ bytes: Buffer.from('This is a shopping list, not a photo.\n'.repeat(20)), name: 'leaf.jpg' }),
      outcome: 'rejected',
      message: /not a recognisable image/,
    },
    {
      name: 'a truncated JPEG',
      photo: async () => {
        const whole = await makeJpeg({ gps: insideField() });
        return { bytes: whole.subarray(0, Math.floor(whole.length * 0.6)) };
      },
      outcome: 'rejected',
      message: /incomplete/,
    },
    { name: 'a zero-byte file', photo: async () => ({ bytes: Buffer.alloc(0) }), outcome: 'rejected', message: /empty/ },
    {
      name: 'a photo without GPS (no walk chosen)',
      photo: async () => ({ bytes: await makeJpeg({}) }),
      outcome: 'rejected',
      message: /no GPS position.*choose the walk first/,
    },
    {
      name: 'GPS (0, 0)',
      photo: async () => ({
        bytes: await makeJpeg({
          rawGps: {
            lat: [
              [0, 1],
              [0, 1],
              [0, 1],
            ],
            latRef: 'N',
            lon: [
              [0, 1],
              [0, 1],
              [0, 1],
            ],
            lonRef: 'E',
          },
        }),
      }),
      outcome: 'rejected',
      message: /0, 0/,
    },
    {
      name: 'GPS outside every field',
      photo: async () => ({ bytes: await makeJpeg({ gps: { lat: -33.9, lon: -60.1 } }) }),
      outcome: 'outside',
      message: /outside every field/,
    },
    {
      name: 'a photo in a field the scout is not assigned to',
      photo: async () => ({ bytes: await makeJpeg({ gps: { lon: SOUTH_WEST_ORIGIN.lon + 0.025, lat: SOUTH_WEST_ORIGIN.lat + 0.005 } }) }),
      outcome: 'rejected',
      message: /not assigned/,
    },
  ];

  for (const c of cases) {
    it(`answers ${c.name} with "${c.outcome}" and keeps no row and no file`, async () => {
      const { org, scout, pest } = await scoutingSetUp();
      const photo = await c.photo();
      const rowsBefore = await rowCounts(org.id);
      const filesBefore = uploadedFiles();
      const res = await uploadPhotos(scout, [photo], { pestId: pest.id }).expect(200);
      expect(res.body.results[0].outcome).toBe(c.outcome);
      expect(res.body.results[0].message).toMatch(c.message);
      expect(res.body.results[0].sightingId).toBeUndefined();
      expect(await rowCounts(org.id)).toEqual(rowsBefore);
      expect(uploadedFiles()).toEqual(filesBefore);
    });
  }

  it('offers the nearest field when a photo lies just outside its boundary', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    // About 20 m south of the southern edge (1° of latitude ≈ 111 km).
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: { lon: SOUTH_WEST_ORIGIN.lon + 0.005, lat: SOUTH_WEST_ORIGIN.lat - 0.00018 } }) }], {
      pestId: pest.id,
    }).expect(200);
    expect(res.body.results[0].outcome).toBe('outside');
    expect(res.body.results[0].nearestField).toMatchObject({ id: field.id, name: field.name });
    expect(res.body.results[0].nearestField.distanceM).toBeGreaterThan(15);
    expect(res.body.results[0].nearestField.distanceM).toBeLessThan(25);
  });

  it('reports a photo sent twice as a duplicate of the first sighting, never a second one', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const bytes = await makeJpeg({ gps: insideField() });
    const first = await uploadPhotos(scout, [{ bytes }], { pestId: pest.id }).expect(200);
    const rowsBefore = await rowCounts(org.id);
    const filesBefore = uploadedFiles();
    const again = await uploadPhotos(scout, [{ bytes }, { bytes }], { pestId: pest.id }).expect(200);
    expect(again.body.results.map((r: { outcome: string }) => r.outcome)).toEqual(['duplicate', 'duplicate']);
    expect(again.body.results[0].sightingId).toBe(first.body.results[0].sightingId);
    expect(again.body.results[0].message).toMatch(/already a sighting/);
    expect(await rowCounts(org.id)).toEqual(rowsBefore);
    expect(uploadedFiles()).toEqual(filesBefore);
  });

  it('never uses a file name with ../ as a path', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const root = process.env.UPLOAD_DIR!;
    const target = path.resolve(root, '..', 'escaped.jpg');
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField() }), name: '../../escaped.jpg' }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('placed');
    expect(res.body.results[0].fileName).toBe('escaped.jpg');
    expect(fs.existsSync(target)).toBe(false);
    const stored = uploadedFiles().filter((f) => f.startsWith(org.id));
    expect(stored).toHaveLength(1);
    expect(stored[0]).toMatch(/^[0-9a-f-]{36}\/\d{4}\/[0-9a-f-]{36}\.jpg$/);
  });

  it('refuses a grower with a sentence and keeps nothing', async () => {
    const { org, pest } = await scoutingSetUp();
    const grower = await signedIn(org.users.grower.email);
    const filesBefore = uploadedFiles();
    const res = await uploadPhotos(grower, [{ bytes: await makeJpeg({ gps: insideField() }) }], { pestId: pest.id });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/Growers can view sightings but not upload/);
    expect(await rowCounts(org.id)).toEqual({ photos: 0, sightings: 0, walks: 0 });
    expect(uploadedFiles()).toEqual(filesBefore);
  });

  it('refuses an upload to a field the scout is not assigned to', async () => {
    const { org, scout, otherField, pest } = await scoutingSetUp();
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({}) }], { pestId: pest.id, fieldId: otherField.id });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/not assigned to that field/);
    expect(await rowCounts(org.id)).toEqual({ photos: 0, sightings: 0, walks: 0 });
  });

  it('answers an oversized file and too many files with 413 and a sentence, storing nothing', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const filesBefore = uploadedFiles();
    const saved = { ...process.env };
    try {
      process.env.PHOTO_MAX_FILE_MB = '0.01';
      const big = await makeJpeg({ width: 1600, height: 1200, gps: insideField(), quality: 95, markSeed: 321 });
      expect(big.length).toBeGreaterThan(0.01 * 1024 * 1024);
      const tooBig = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField(0.1, 0.1) }) }, { bytes: big, name: 'big.jpg' }], {
        pestId: pest.id,
      });
      expect(tooBig.status).toBe(413);
      expect(tooBig.body.error.message).toMatch(/big\.jpg.*larger than 0\.01 MB/);
      delete process.env.PHOTO_MAX_FILE_MB;

      process.env.PHOTO_MAX_FILES = '2';
      const three = await Promise.all([0.2, 0.4, 0.6].map((f) => makeJpeg({ gps: insideField(f, f) })));
      const tooMany = await uploadPhotos(
        scout,
        three.map((bytes) => ({ bytes })),
        { pestId: pest.id },
      );
      expect(tooMany.status).toBe(413);
      expect(tooMany.body.error.message).toMatch(/at most 2 photos/);
    } finally {
      process.env = saved;
    }
    expect(await rowCounts(org.id)).toEqual({ photos: 0, sightings: 0, walks: 0 });
    expect(uploadedFiles()).toEqual(filesBefore);
  });
});

describe('photos without a usable position', () => {
  it('keeps a no-GPS photo on the chosen walk as needs-pin, and a pin inside the field places it', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-20' }).expect(201);
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({}) }], { pestId: pest.id, walkId: walk.body.walk.id, count: 4 }).expect(200);
    expect(res.body.results[0]).toMatchObject({ outcome: 'needs-pin', walkId: walk.body.walk.id, fieldId: field.id });
    const id = res.body.results[0].sightingId;

    const outside = await scout.patch(`/api/sightings/${id}`, { position: { lon: -60, lat: -34 } });
    expect(outside.status).toBe(400);
    expect(outside.body.error.message).toMatch(/outside .*tap a point inside/);

    const pinned = await scout.patch(`/api/sightings/${id}`, { position: insideField(0.4, 0.6) }).expect(200);
    expect(pinned.body.sighting).toMatchObject({ status: 'placed', positionSource: 'pin', count: 4, timeFlag: 'missing' });
    expect(pinned.body.sighting.position.lon).toBeCloseTo(insideField(0.4, 0.6).lon, 12);
  });

  it('flags a camera clock in the future or years old and does not date the walk by it', async () => {
    const { scout, pest } = await scoutingSetUp();
    const future = await makeJpeg({ gps: insideField(0.3, 0.3), dateTimeOriginal: '2031:01:01 12:00:00', offsetTimeOriginal: '-03:00' });
    const old = await makeJpeg({ gps: insideField(0.6, 0.6), dateTimeOriginal: '2019:06:01 12:00:00', offsetTimeOriginal: '-03:00' });
    const res = await uploadPhotos(scout, [{ bytes: future }, { bytes: old }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].message).toMatch(/in the future/);
    expect(res.body.results[1].message).toMatch(/over two years old/);
    const list = await scout.get(`/api/sightings?walkId=${res.body.results[0].walkId}`).expect(200);
    expect(list.body.sightings.map((s: { timeFlag: string }) => s.timeFlag).sort()).toEqual(['future', 'old']);
    expect(list.body.sightings[0].walkedOn).not.toMatch(/^(2031|2019)/);
  });
});

describe('storage and thumbnails', () => {
  it('removes a file written without its database row once the clean-up runs, keeping committed files', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const kept = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField() }) }], { pestId: pest.id }).expect(200);
    expect(kept.body.results[0].outcome).toBe('placed');
    // A crash between the file write and the commit: the file is there, the row never was.
    const orphanKey = newStorageKey(org.id, 'jpg');
    await writeStored(orphanKey, await makeJpeg({ gps: insideField() }));
    expect(fs.existsSync(storedPath(orphanKey))).toBe(true);
    const committedBefore = uploadedFiles().filter((f) => f.startsWith(org.id) && !f.includes(orphanKey.split('/')[2]));

    const { removed } = await removeOrphanFiles({ graceMs: 0 });
    expect(removed).toContain(storedPath(orphanKey));
    expect(fs.existsSync(storedPath(orphanKey))).toBe(false);
    expect(uploadedFiles().filter((f) => f.startsWith(org.id))).toEqual(committedBefore);
  });

  it('makes a thumbnail that honours EXIF orientation 6 (width and height swap) and serves it', async () => {
    const { scout, pest } = await scoutingSetUp();
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ width: 400, height: 200, orientation: 6, gps: insideField() }) }], {
      pestId: pest.id,
    }).expect(200);
    const { photoId } = res.body.results[0];
    const pending = await scout.get(`/api/photos/${photoId}/thumbnail`);
    expect(pending.status).toBe(404);
    expect(pending.body.error.message).toMatch(/still being made/);

    expect(await makeThumbnail(photoId)).toMatchObject({ status: 'ready' });
    const thumb = await scout.get(`/api/photos/${photoId}/thumbnail`).buffer(true).expect(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    expect(thumb.headers['cache-control']).toBe('private, no-store');
    const image = await Jimp.read(thumb.body as Buffer);
    // Orientation 6 (TIFF 6.0 tag 274: row 0 is the visual right side): a 400 × 200 photo stands 200 × 400.
    expect(image.bitmap.height).toBeGreaterThan(image.bitmap.width);
    expect(image.bitmap.height / image.bitmap.width).toBeCloseTo(2, 1);
  });

  it('keeps each part of a large photo where it belongs when turning it upright for orientation 6', async () => {
    const { scout, pest } = await scoutingSetUp();
    // 1600 × 1200, well past twice the 320 px edge, so the decode path's prescale runs; the stored top-left quarter is red.
    const picture = new Jimp({ width: 1600, height: 1200, color: 0x4f8a2bff });
    picture.scan(0, 0, 800, 600, (_x, _y, idx) => void picture.bitmap.data.set([220, 30, 30], idx));
    const photo = await withExif(await picture.getBuffer('image/jpeg', { quality: 90 }), { orientation: 6, gps: insideField() });
    const res = await uploadPhotos(scout, [{ bytes: photo }], { pestId: pest.id }).expect(200);
    expect(await makeThumbnail(res.body.results[0].photoId)).toEqual({ status: 'ready', source: 'decoded' });
    const thumb = await Jimp.read((await scout.get(`/api/photos/${res.body.results[0].photoId}/thumbnail`).buffer(true).expect(200)).body as Buffer);
    expect([thumb.bitmap.width, thumb.bitmap.height]).toEqual([240, 320]);
    const rgbAt = (x: number, y: number) => Array.from(thumb.bitmap.data.subarray((y * 240 + x) * 4, (y * 240 + x) * 4 + 3));
    // TIFF 6.0 tag 274, value 6: stored row 0 is the visual right side and stored column 0 the visual top, so the
    // stored top-left quarter stands at the top right; the other quarters keep the leaf green.
    const [r, g] = rgbAt(180, 80);
    expect(r).toBeGreaterThan(180);
    expect(g).toBeLessThan(80);
    for (const [x, y] of [
      [60, 80],
      [60, 240],
      [180, 240],
    ]) {
      const [qr, qg] = rgbAt(x, y);
      expect(qg).toBeGreaterThan(qr);
    }
  });

  it('uses the embedded EXIF thumbnail when the photo carries one, turned upright', async () => {
    const { scout, pest } = await scoutingSetUp();
    const res = await uploadPhotos(
      scout,
      [{ bytes: await makeJpeg({ width: 800, height: 600, orientation: 8, embeddedThumbnailWidth: 200, gps: insideField() }) }],
      { pestId: pest.id },
    ).expect(200);
    expect(await makeThumbnail(res.body.results[0].photoId)).toEqual({ status: 'ready', source: 'embedded' });
    const thumb = await scout.get(`/api/photos/${res.body.results[0].photoId}/thumbnail`).buffer(true).expect(200);
    const image = await Jimp.read(thumb.body as Buffer);
    expect([image.bitmap.width, image.bitmap.height]).toEqual([150, 200]);
  });

  it('marks a photo whose pixels cannot be decoded as failed and keeps its sighting', async () => {
    const { scout, pest } = await scoutingSetUp();
    // A whole JPEG structure whose scan data is noise: it passes the upload checks but will not decode.
    const good = await makeJpeg({ gps: insideField() });
    const sos = good.indexOf(Buffer.from([0xff, 0xda]));
    const broken = Buffer.concat([good.subarray(0, sos), Buffer.from([0xff, 0xda, 0x00, 0x02]), Buffer.alloc(64, 0x11), Buffer.from([0xff, 0xd9])]);
    const res = await uploadPhotos(scout, [{ bytes: broken }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('placed');
    expect(await makeThumbnail(res.body.results[0].photoId)).toMatchObject({ status: 'failed' });
    const sighting = await scout.get(`/api/sightings/${res.body.results[0].sightingId}`).expect(200);
    expect(sighting.body.sighting).toMatchObject({ thumbnailStatus: 'failed', status: 'placed' });
  });

  it('a batch sent again queues the thumbnail a stored photo lost with its process', async () => {
    const { scout, pest } = await scoutingSetUp();
    const bytes = await makeJpeg({ gps: insideField(0.3, 0.6), markSeed: 777 });
    const first = await uploadPhotos(scout, [{ bytes }], { pestId: pest.id }).expect(200);
    const photoId = first.body.results[0].photoId as string;
    const jobs = async () => {
      const [row] = await sequelize.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'photo-thumbnail' AND data->>'photoId' = :photoId`,
        {
          replacements: { photoId },
          type: QueryTypes.SELECT,
        },
      );
      return row.n;
    };
    // As if the process had died after committing the photo and before queuing its thumbnail.
    await sequelize.query(`DELETE FROM pgboss.job WHERE name = 'photo-thumbnail' AND data->>'photoId' = :photoId`, { replacements: { photoId } });
    expect(await jobs()).toBe(0);

    const again = await uploadPhotos(scout, [{ bytes }], { pestId: pest.id }).expect(200);
    expect(again.body.results[0]).toMatchObject({ outcome: 'duplicate', photoId });
    expect(await jobs()).toBe(1);
  });

  it('the queued job makes the thumbnail once workers run', async () => {
    await startWorkers();
    const { scout, pest } = await scoutingSetUp();
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField() }) }], { pestId: pest.id }).expect(200);
    let status = 'pending';
    for (let i = 0; i < 100 && status === 'pending'; i++) {
      await new Promise((r) => setTimeout(r, 200));
      status = (await scout.get(`/api/sightings/${res.body.results[0].sightingId}`)).body.sighting.thumbnailStatus;
    }
    expect(status).toBe('ready');
  });
});
