// HEIC photos keep their GPS position whichever way the file locates its Exif item. The two files are real HEIC
// made by libheif's heif-enc with GPS written by exiftool (tests/fixtures/photos/make-heic-fixtures.sh): one
// locates the Exif item by base_offset, the other by extent_offset (ISO/IEC 14496-12 §8.11.3, ItemLocationBox).
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { readPhotoExif } from '../../server/services/exif-reading.ts';
import { degreeRectangle } from '../helpers/boundary-shapes.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';

const fixture = (name: string) => fs.readFileSync(path.join('tests/fixtures/photos', name));
// What the fixture script wrote with exiftool: 41.2345 N, 96.5432 W (EXIF 2.32 §4.6.6: W is negative longitude).
const WRITTEN = { lon: -96.5432, lat: 41.2345 };
const layouts = ['exif-in-base-offset.heic', 'exif-in-extent-offset.heic'];

afterAll(async () => {
  await stopQueue();
  await closeThumbnailPool();
});

describe('HEIC photos and their Exif item location', () => {
  it.each(layouts)('reads the GPS position and time of %s', async (name) => {
    const reading = await readPhotoExif(fixture(name), new Date('2026-07-02T00:00:00Z'));
    expect(reading.positionProblem).toBeNull();
    expect(reading.position!.lon).toBeCloseTo(WRITTEN.lon, 6);
    expect(reading.position!.lat).toBeCloseTo(WRITTEN.lat, 6);
    expect(reading.kept.DateTimeOriginal).toBeDefined();
  });

  it('places an uploaded base-offset HEIC at its position instead of asking for a pin', async () => {
    const org = await makeOrganisation('HEIC');
    const admin = await signedIn(org.users.admin.email);
    const farm = await createFarm(admin);
    const field = await createField(admin, farm.id, degreeRectangle(WRITTEN.lon - 0.005, WRITTEN.lat - 0.005, 0.01, 0.01));
    await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id }).expect(204);
    const pest = await createPest(admin);
    const scout = await signedIn(org.users.scout.email);
    const req = scout.agent
      .post('/api/photos')
      .set('x-csrf-token', scout.csrf)
      .field('pestId', pest.id)
      .field('counts', JSON.stringify([2]));
    const res = await req.attach('photos', fixture('exif-in-base-offset.heic'), { filename: 'leaf.heic', contentType: 'image/heic' }).expect(200);
    expect(res.body.results[0].outcome).toBe('placed');
    const list = await scout.get(`/api/sightings?walkId=${res.body.results[0].walkId}`).expect(200);
    const [sighting] = list.body.sightings;
    expect(sighting.position.lon).toBeCloseTo(WRITTEN.lon, 6);
    expect(sighting.position.lat).toBeCloseTo(WRITTEN.lat, 6);
  });
});
