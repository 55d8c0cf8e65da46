import { afterAll, describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { auditLog } from '../helpers/farm-records.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';

afterAll(async () => {
  await stopQueue();
});

describe('walks', () => {
  it('starts a walk on an assigned field, and starting the same field and day again returns it', async () => {
    const { scout, field, org } = await scoutingSetUp();
    const first = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21', notes: 'W pattern from the east gate' }).expect(201);
    expect(first.body.walk).toMatchObject({
      fieldId: field.id,
      fieldName: field.name,
      scoutId: org.users.scout.id,
      scoutName: org.users.scout.name,
      walkedOn: '2026-11-21',
      notes: 'W pattern from the east gate',
      sightingCount: 0,
      stopCount: 0,
    });
    const again = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(200);
    expect(again.body.walk.id).toBe(first.body.walk.id);
  });

  it('refuses a walk on a field the scout is not assigned to, and any walk from a grower', async () => {
    const { scout, otherField, org, field } = await scoutingSetUp();
    const res = await scout.post('/api/walks', { fieldId: otherField.id, walkedOn: '2026-11-21' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/not assigned/);
    const grower = await signedIn(org.users.grower.email);
    const refused = await grower.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' });
    expect(refused.status).toBe(403);
  });

  it('keeps the id a phone gave a walk started without signal, and answers a second phone id with the walk already there', async () => {
    const { scout, field } = await scoutingSetUp();
    const phoneId = crypto.randomUUID();
    const first = await scout.post('/api/walks', { id: phoneId, fieldId: field.id, walkedOn: '2026-11-22' }).expect(201);
    expect(first.body.walk).toMatchObject({ id: phoneId, fieldId: field.id, walkedOn: '2026-11-22' });
    await scout.get(`/api/walks/${phoneId}`).expect(200);
    // Sent again (the answer was lost) or from a second phone: the walk of that field and day, never a second one.
    expect((await scout.post('/api/walks', { id: phoneId, fieldId: field.id, walkedOn: '2026-11-22' }).expect(200)).body.walk.id).toBe(phoneId);
    const other = await scout.post('/api/walks', { id: crypto.randomUUID(), fieldId: field.id, walkedOn: '2026-11-22' }).expect(200);
    expect(other.body.walk.id).toBe(phoneId);
    const listed = await scout.get(`/api/walks?fieldId=${field.id}`).expect(200);
    expect(listed.body.walks.filter((w: { walkedOn: string }) => w.walkedOn === '2026-11-22')).toHaveLength(1);

    // An id another walk holds (here the one above, for another day) is refused in a sentence, and makes no walk.
    const taken = await scout.post('/api/walks', { id: phoneId, fieldId: field.id, walkedOn: '2026-11-23' });
    expect(taken.status).toBe(409);
    expect(taken.body.error.message).toMatch(/already used by another walk; start the walk again/);
    const after = await scout.get(`/api/walks?fieldId=${field.id}`).expect(200);
    expect(after.body.walks.map((w: { walkedOn: string }) => w.walkedOn)).not.toContain('2026-11-23');
    const bad = await scout.post('/api/walks', { id: 'not-a-uuid', fieldId: field.id, walkedOn: '2026-11-24' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/walk id from the phone must be a UUID/);
  });

  it('explains a bad walk date', async () => {
    const { scout, field } = await scoutingSetUp();
    const res = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-02-30' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not a real calendar date/);
  });

  it('finds or creates the walk from the photo’s own date and counts sightings and empty stops apart', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const res = await uploadPhotos(
      scout,
      [{ bytes: await makeJpeg({ gps: insideField(0.3, 0.3), dateTimeOriginal: '2026:11:19 08:00:00', offsetTimeOriginal: '-03:00' }) }],
      { pestId: pest.id },
    ).expect(200);
    const walkId = res.body.results[0].walkId;
    const stop = await scout.post(`/api/walks/${walkId}/stops`, { pestId: pest.id, ...insideField(0.8, 0.2), accuracyM: 6 }).expect(201);
    expect(stop.body.sighting).toMatchObject({ count: 0, positionSource: 'device', photoId: null, isEmptyStop: true, accuracyM: 6, status: 'placed' });

    const detail = await scout.get(`/api/walks/${walkId}`).expect(200);
    expect(detail.body.walk).toMatchObject({ fieldId: field.id, walkedOn: '2026-11-19', sightingCount: 1, stopCount: 1 });
    expect(detail.body.sightings).toHaveLength(2);
    const list = await scout.get(`/api/walks?fieldId=${field.id}`).expect(200);
    expect(list.body.walks.map((w: { id: string }) => w.id)).toEqual([walkId]);
  });

  it('refuses an empty stop outside the walk’s field with a sentence', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const res = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, { pestId: pest.id, lon: -60, lat: -34, accuracyM: 5 });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/outside .* walk into the field/);
  });

  it('records a stop sent twice under one client id once, keeping the time it was recorded on the phone', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const stop = { pestId: pest.id, ...insideField(0.4, 0.6), accuracyM: 7, clientId: 'phone-stop-1', observedAt: '2026-11-21T09:15:00-03:00' };
    const first = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, stop).expect(201);
    const again = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, stop).expect(200);
    expect(again.body.sighting.id).toBe(first.body.sighting.id);
    // 09:15 at UTC−03:00 is 12:15 UTC (ISO 8601 offsets).
    expect(new Date(first.body.sighting.observedAt).toISOString()).toBe('2026-11-21T12:15:00.000Z');
    const detail = await scout.get(`/api/walks/${walk.body.walk.id}`).expect(200);
    expect(detail.body.walk.stopCount).toBe(1);
  });

  it('does not bring back a removed stop when the phone sends it again', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const stop = { pestId: pest.id, ...insideField(0.5, 0.5), accuracyM: 4, clientId: 'phone-stop-2' };
    const first = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, stop).expect(201);
    await scout.delete(`/api/sightings/${first.body.sighting.id}`).expect(204);
    const again = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, stop);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/removed/);
    const detail = await scout.get(`/api/walks/${walk.body.walk.id}`).expect(200);
    expect(detail.body.walk.stopCount).toBe(0);
  });

  it('refuses a stop time in the future with a sentence', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const later = new Date(Date.now() + 86_400_000).toISOString();
    const res = await scout.post(`/api/walks/${walk.body.walk.id}/stops`, { pestId: pest.id, ...insideField(0.5, 0.5), accuracyM: 4, observedAt: later });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/future/);
  });

  it('edits notes and date, audited', async () => {
    const { scout, field, org } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const res = await scout.patch(`/api/walks/${walk.body.walk.id}`, { notes: 'Wet headland', walkedOn: '2026-11-22' }).expect(200);
    expect(res.body.walk).toMatchObject({ notes: 'Wet headland', walkedOn: '2026-11-22' });
    const entry = (await auditLog(org.id)).find((e) => e.entity === 'walk' && e.action === 'update');
    expect(entry?.changes).toMatchObject({ before: { walkedOn: '2026-11-21', notes: '' }, after: { walkedOn: '2026-11-22', notes: 'Wet headland' } });
  });

  it('shows growers the walks on their own farms only, read only, and other organisations nothing', async () => {
    const { admin, scout, field, org } = await scoutingSetUp();
    const walk = await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-21' }).expect(201);
    const grower = await signedIn(org.users.grower.email);
    expect((await grower.get('/api/walks')).body.walks).toEqual([]);
    const farmId = (await admin.get(`/api/fields/${field.id}`)).body.field.farmId;
    expect((await admin.post(`/api/farms/${farmId}/growers`, { userId: org.users.grower.id })).status).toBeLessThan(300);
    expect((await grower.get('/api/walks')).body.walks.map((w: { id: string }) => w.id)).toEqual([walk.body.walk.id]);
    const adviser = await signedIn(org.users.adviser.email);
    expect((await adviser.get('/api/walks')).body.walks.map((w: { id: string }) => w.id)).toContain(walk.body.walk.id);
    expect((await grower.patch(`/api/walks/${walk.body.walk.id}`, { notes: 'x' })).status).toBeGreaterThanOrEqual(403);

    const stranger = await makeOrganisation('Other');
    const outsider = await signedIn(stranger.users.admin.email);
    expect((await outsider.get('/api/walks')).body.walks).toEqual([]);
    expect((await outsider.get(`/api/walks/${walk.body.walk.id}`)).status).toBe(404);
  });
});
