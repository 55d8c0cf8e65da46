import { afterAll, describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { auditLog, createPest } from '../helpers/farm-records.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { sequelize } from '../../server/db.ts';
import { purgeDeletedSightings } from '../../server/services/photo-purge.ts';

afterAll(async () => {
  await stopQueue();
});

async function oneSighting() {
  const setUp = await scoutingSetUp();
  const res = await uploadPhotos(setUp.scout, [{ bytes: await makeJpeg({ gps: insideField(0.25, 0.25) }) }], { pestId: setUp.pest.id, count: 7 }).expect(200);
  return {
    ...setUp,
    sightingId: res.body.results[0].sightingId as string,
    photoId: res.body.results[0].photoId as string,
    walkId: res.body.results[0].walkId as string,
  };
}

describe('sightings', () => {
  it('asks an adviser to choose a field, and filters by field, pest, status and date', async () => {
    const { org, field, sightingId } = await oneSighting();
    const adviser = await signedIn(org.users.adviser.email);
    const bare = await adviser.get('/api/sightings');
    expect(bare.status).toBe(400);
    expect(bare.body.error.message).toMatch(/Choose a field/);
    expect((await adviser.get(`/api/sightings?fieldId=${field.id}`)).body.sightings.map((s: { id: string }) => s.id)).toEqual([sightingId]);
    expect((await adviser.get(`/api/sightings?fieldId=${field.id}&status=needs-pin`)).body.sightings).toEqual([]);
    expect((await adviser.get(`/api/sightings?fieldId=${field.id}&from=2999-01-01`)).body.sightings).toEqual([]);
    const badQuery = await adviser.get(`/api/sightings?fieldId=${field.id}&status=lost`);
    expect(badQuery.status).toBe(400);
  });

  it('lets an adviser change pest and count, writing before and after to the audit log', async () => {
    const { org, admin, sightingId } = await oneSighting();
    const adviser = await signedIn(org.users.adviser.email);
    const otherPest = await createPest(admin);
    const res = await adviser.patch(`/api/sightings/${sightingId}`, { pestId: otherPest.id, count: 11 }).expect(200);
    expect(res.body.sighting).toMatchObject({ pestId: otherPest.id, pestName: otherPest.name, count: 11, positionSource: 'exif' });
    const entry = (await auditLog(org.id)).find((e) => e.entity === 'sighting' && e.action === 'update');
    expect(entry?.changes).toMatchObject({ before: { count: 7 }, after: { count: 11, pestId: otherPest.id } });
  });

  it('lets only advisers and the scout who made it edit', async () => {
    const { org, sightingId } = await oneSighting();
    const grower = await signedIn(org.users.grower.email);
    expect((await grower.patch(`/api/sightings/${sightingId}`, { count: 1 })).status).toBe(404);
    const stranger = await makeOrganisation('Other');
    const outsider = await signedIn(stranger.users.admin.email);
    expect((await outsider.patch(`/api/sightings/${sightingId}`, { count: 1 })).status).toBe(404);
    expect((await outsider.delete(`/api/sightings/${sightingId}`)).status).toBe(404);
  });

  it('moves a sighting by hand only inside its field, recording the pin as its source', async () => {
    const { scout, sightingId } = await oneSighting();
    const refused = await scout.patch(`/api/sightings/${sightingId}`, { position: { lon: -61, lat: -35 } });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.position).toMatch(/outside/);
    const moved = await scout.patch(`/api/sightings/${sightingId}`, { position: insideField(0.9, 0.9) }).expect(200);
    expect(moved.body.sighting.positionSource).toBe('pin');
  });

  it('deletes softly, keeps the photo, restores, and purges after 30 days', async () => {
    const { org, scout, admin, sightingId, photoId, walkId } = await oneSighting();
    await scout.delete(`/api/sightings/${sightingId}`).expect(204);
    expect((await scout.get(`/api/sightings?walkId=${walkId}`)).body.sightings).toEqual([]);
    expect((await admin.get(`/api/photos/${photoId}/original`)).status).toBe(200);
    const restored = await scout.post(`/api/sightings/${sightingId}/restore`).expect(200);
    expect(restored.body.sighting.id).toBe(sightingId);

    await scout.delete(`/api/sightings/${sightingId}`).expect(204);
    await sequelize.query(`UPDATE sightings SET deleted_at = now() - interval '31 days' WHERE id = :sightingId`, { replacements: { sightingId } });
    const purged = await purgeDeletedSightings();
    expect(purged.sightings).toBeGreaterThanOrEqual(1);
    expect((await admin.get(`/api/photos/${photoId}/original`)).status).toBe(404);
    expect((await scout.post(`/api/sightings/${sightingId}/restore`)).status).toBe(404);
    expect((await auditLog(org.id)).filter((e) => e.entity === 'sighting').map((e) => e.action)).toEqual(['create', 'delete', 'restore', 'delete']);
  });
});
