// A scout removes a wrong photo of their own from a walk and brings it back; nobody else's scout can.
import { afterAll, describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { addUser, makeOrganisation } from '../helpers/org.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { sequelize } from '../../server/db.ts';

afterAll(async () => {
  await stopQueue();
});

async function walkWithTwoPhotos() {
  const setUp = await scoutingSetUp();
  const res = await uploadPhotos(
    setUp.scout,
    [{ bytes: await makeJpeg({ gps: insideField(0.2, 0.3), markSeed: 301 }) }, { bytes: await makeJpeg({ gps: insideField(0.6, 0.7), markSeed: 302 }) }],
    { pestId: setUp.pest.id, count: 2 },
  ).expect(200);
  const [wrong, right] = res.body.results as Array<{ sightingId: string; walkId: string }>;
  return { ...setUp, walkId: wrong.walkId, wrongId: wrong.sightingId, rightId: right.sightingId };
}

type Detail = { walk: { sightingCount: number }; sightings: Array<{ id: string }>; removed: Array<{ id: string }> };
const ids = (list: Array<{ id: string }>) => list.map((s) => s.id);

describe('removing a wrong photo from a walk', () => {
  it('moves the scout’s own sighting to the walk’s removed list and back again', async () => {
    const { scout, walkId, wrongId, rightId } = await walkWithTwoPhotos();
    await scout.delete(`/api/sightings/${wrongId}`).expect(204);
    const after = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as Detail;
    expect(ids(after.sightings)).toEqual([rightId]);
    expect(ids(after.removed)).toEqual([wrongId]);
    expect(after.walk.sightingCount).toBe(1);

    await scout.post(`/api/sightings/${wrongId}/restore`).expect(200);
    const back = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as Detail;
    expect(ids(back.sightings).sort()).toEqual([rightId, wrongId].sort());
    expect(back.removed).toEqual([]);
    expect(back.walk.sightingCount).toBe(2);
  });

  it('refuses another scout of the organisation, and shows them nothing to restore', async () => {
    const { org, admin, field, scout, walkId, wrongId } = await walkWithTwoPhotos();
    const other = await addUser(org, 'scout');
    await admin.post(`/api/fields/${field.id}/scouts`, { userId: other.id }).expect(204);
    const otherScout = await signedIn(other.email);
    const refused = await otherScout.delete(`/api/sightings/${wrongId}`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/scout who recorded this sighting/);

    await scout.delete(`/api/sightings/${wrongId}`).expect(204);
    expect((await otherScout.post(`/api/sightings/${wrongId}/restore`)).status).toBe(403);
    expect(((await otherScout.get(`/api/walks/${walkId}`).expect(200)).body as Detail).removed).toEqual([]);
  });

  it('lets an adviser of the organisation remove and restore, and finds nothing for another organisation', async () => {
    const { org, walkId, wrongId } = await walkWithTwoPhotos();
    const stranger = await signedIn((await makeOrganisation('Elsewhere')).users.admin.email);
    expect((await stranger.delete(`/api/sightings/${wrongId}`)).status).toBe(404);

    const adviser = await signedIn(org.users.adviser.email);
    await adviser.delete(`/api/sightings/${wrongId}`).expect(204);
    expect(ids(((await adviser.get(`/api/walks/${walkId}`).expect(200)).body as Detail).removed)).toEqual([wrongId]);
    expect((await stranger.post(`/api/sightings/${wrongId}/restore`)).status).toBe(404);
    await adviser.post(`/api/sightings/${wrongId}/restore`).expect(200);
  });

  it('leaves a sighting removed more than 30 days ago off the list', async () => {
    const { scout, walkId, wrongId } = await walkWithTwoPhotos();
    await scout.delete(`/api/sightings/${wrongId}`).expect(204);
    await sequelize.query(`UPDATE sightings SET deleted_at = now() - interval '31 days' WHERE id = :wrongId`, { replacements: { wrongId } });
    expect(((await scout.get(`/api/walks/${walkId}`).expect(200)).body as Detail).removed).toEqual([]);
    expect((await scout.post(`/api/sightings/${wrongId}/restore`)).status).toBe(410);
  });
});
