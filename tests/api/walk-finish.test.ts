// Finishing a walk: who may, that a second finish keeps the first time, and that a late photo from a phone still lands.
import { afterAll, describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { addUser, makeOrganisation } from '../helpers/org.ts';
import { auditLog } from '../helpers/farm-records.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';

afterAll(async () => {
  await stopQueue();
});

async function openWalk() {
  const setUp = await scoutingSetUp();
  const walk = (await setUp.scout.post('/api/walks', { fieldId: setUp.field.id, walkedOn: '2026-11-24' }).expect(201)).body.walk;
  return { ...setUp, walkId: walk.id as string };
}

describe('finishing a walk', () => {
  it('records when the scout finished, and finishing again keeps the first time', async () => {
    const { scout, org, walkId } = await openWalk();
    expect((await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk.finishedAt).toBeNull();
    const before = Date.now();
    const first = (await scout.post(`/api/walks/${walkId}/finish`, {}).expect(200)).body.walk;
    const after = Date.now();
    // An ISO 8601 instant (ECMA-262 Date.parse), taken by the server between the request and the answer (a second of clock slack).
    expect(Date.parse(first.finishedAt)).toBeGreaterThanOrEqual(before - 1000);
    expect(Date.parse(first.finishedAt)).toBeLessThanOrEqual(after + 1000);
    const again = (await scout.post(`/api/walks/${walkId}/finish`, {}).expect(200)).body.walk;
    expect(again.finishedAt).toBe(first.finishedAt);
    expect((await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk.finishedAt).toBe(first.finishedAt);
    const finishes = (await auditLog(org.id)).filter((row) => row.action === 'finish' && row.entity_id === walkId);
    expect(finishes).toHaveLength(1);
  });

  it('lets the desk roles of the organisation finish a walk, not another scout, a grower or another organisation', async () => {
    const { org, admin, field, walkId } = await openWalk();
    const otherScout = await addUser(org, 'scout');
    await admin.post(`/api/fields/${field.id}/scouts`, { userId: otherScout.id }).expect(204);
    const refused = await (await signedIn(otherScout.email)).post(`/api/walks/${walkId}/finish`, {});
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/another scout/);
    expect((await (await signedIn(org.users.grower.email)).post(`/api/walks/${walkId}/finish`, {})).status).toBe(403);
    const stranger = await makeOrganisation('Elsewhere');
    expect((await (await signedIn(stranger.users.admin.email)).post(`/api/walks/${walkId}/finish`, {})).status).toBe(404);
    expect((await admin.get(`/api/walks/${walkId}`).expect(200)).body.walk.finishedAt).toBeNull();
    const byAdviser = (await (await signedIn(org.users.adviser.email)).post(`/api/walks/${walkId}/finish`, {}).expect(200)).body.walk;
    expect(byAdviser.finishedAt).not.toBeNull();
    expect((await admin.post(`/api/walks/${walkId}/finish`, {}).expect(200)).body.walk.finishedAt).toBe(byAdviser.finishedAt);
  });

  it('refuses a body with fields in it, with a sentence, and leaves the walk open', async () => {
    const { scout, walkId } = await openWalk();
    const res = await scout.post(`/api/walks/${walkId}/finish`, { finishedAt: '2026-11-24T09:00:00Z' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/takes no fields/);
    expect((await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk.finishedAt).toBeNull();
  });

  it('still takes a photo and a stop sent late from the phone after the walk was finished', async () => {
    const { scout, pest, walkId } = await openWalk();
    await scout.post(`/api/walks/${walkId}/finish`, {}).expect(200);
    const upload = await uploadPhotos(scout, [{ bytes: await makeJpeg({ gps: insideField(0.4, 0.4) }) }], {
      pestId: pest.id,
      walkId,
      clientIds: '["late-1"]',
    }).expect(200);
    expect(upload.body.results[0].outcome).toBe('placed');
    await scout.post(`/api/walks/${walkId}/stops`, { pestId: pest.id, ...insideField(0.6, 0.6), accuracyM: 5, clientId: 'late-stop' }).expect(201);
    const walk = (await scout.get(`/api/walks/${walkId}`).expect(200)).body.walk;
    expect(walk).toMatchObject({ sightingCount: 1, stopCount: 1 });
  });
});
