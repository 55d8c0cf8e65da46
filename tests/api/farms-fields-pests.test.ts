// What an admin does day to day: farms and their grower contacts, fields, scouts and growers, the pest
// library and users, each change written to the audit log.
import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { auditLog, createFarm, createField, createPest, fieldCount } from '../helpers/farm-records.ts';
import { plainField } from '../helpers/boundary-shapes.ts';
import { makeScoutedField, stopsFrom, TEST_FIELD_CORNER } from '../helpers/sightings.ts';

async function adminOfNewOrganisation() {
  const org = await makeOrganisation('Records');
  return { org, admin: await signedIn(org.users.admin.email) };
}

const byEmail = (a: { email: string }, b: { email: string }) => a.email.localeCompare(b.email);

describe('farms and grower contacts', () => {
  it('creates a farm with its grower contacts and logs who did it', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const contacts = [
      { name: 'Dana Fieldhouse', email: 'dana@grower.example' },
      { name: 'Lee Harrow', email: 'lee@grower.example' },
    ];
    const farm = await createFarm(admin, { name: 'Willow Bend', contacts });
    const read = await admin.get(`/api/farms/${farm.id}`).expect(200);
    expect(read.body.farm.name).toBe('Willow Bend');
    expect(read.body.farm.contacts.map(({ name, email }: { name: string; email: string }) => ({ name, email })).sort(byEmail)).toEqual(contacts);
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({ action: 'create', entity: 'farm', entity_id: farm.id, user_id: org.users.admin.id }),
    );
  });

  it('edits a farm: renames it and replaces its contacts', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const farm = await createFarm(admin, { contacts: [{ name: 'Old Contact', email: 'old@grower.example' }] });
    const res = await admin.put(`/api/farms/${farm.id}`, { name: 'Stony Creek', contacts: [{ name: 'New Contact', email: 'new@grower.example' }] }).expect(200);
    expect(res.body.farm.name).toBe('Stony Creek');
    expect(res.body.farm.contacts.map((c: { email: string }) => c.email)).toEqual(['new@grower.example']);
    expect(await auditLog(org.id)).toContainEqual(expect.objectContaining({ action: 'update', entity: 'farm', entity_id: farm.id }));
  });

  it('refuses two contacts with the same e-mail address, whatever its case, and changes nothing', async () => {
    const { admin } = await adminOfNewOrganisation();
    const farm = await createFarm(admin, { name: 'Keep Me', contacts: [{ name: 'Only Contact', email: 'only@grower.example' }] });
    const res = await admin.put(`/api/farms/${farm.id}`, {
      name: 'Renamed Anyway',
      contacts: [
        { name: 'First', email: 'same@grower.example' },
        { name: 'Second', email: 'SAME@grower.example' },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('Each grower contact needs a different e-mail address.');
    expect(res.body.error.fields.contacts).toBe(res.body.error.message);
    const after = await admin.get(`/api/farms/${farm.id}`).expect(200);
    expect(after.body.farm).toMatchObject({ name: 'Keep Me', contacts: [expect.objectContaining({ email: 'only@grower.example' })] });
  });

  it('refuses a contact e-mail that is not an address, naming the contact', async () => {
    const { admin } = await adminOfNewOrganisation();
    const res = await admin.post('/api/farms', { name: 'Bad Address Farm', contacts: [{ name: 'Typo', email: 'typo.grower.example' }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['contacts.0.email']).toMatch(/valid e-mail address/);
  });

  it('deletes a farm without fields and logs it; a farm with fields is refused by name and kept', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const empty = await createFarm(admin, { name: 'Short Lease' });
    await admin.delete(`/api/farms/${empty.id}`).expect(204);
    await admin.get(`/api/farms/${empty.id}`).expect(404);
    expect(await auditLog(org.id)).toContainEqual(expect.objectContaining({ action: 'delete', entity: 'farm', entity_id: empty.id }));

    const farmed = await createFarm(admin, { name: 'Long Lease' });
    await createField(admin, farmed.id);
    const res = await admin.delete(`/api/farms/${farmed.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Long Lease still has 1 field; delete it first, then the farm.');
    expect((await admin.get(`/api/farms/${farmed.id}`).expect(200)).body.farm.name).toBe('Long Lease');
  });

  it('refuses a second farm of the same name in one organisation', async () => {
    const { admin } = await adminOfNewOrganisation();
    await createFarm(admin, { name: 'Twin Oaks' });
    const res = await admin.post('/api/farms', { name: 'Twin Oaks', contacts: [] });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already in use/);
  });
});

describe('fields, scouts and growers', () => {
  it('deletes a field: it is gone, its row is removed and the deletion is logged', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const field = await createField(admin, (await createFarm(admin)).id);
    const before = await fieldCount(org.id);
    await admin.delete(`/api/fields/${field.id}`).expect(204);
    await admin.get(`/api/fields/${field.id}`).expect(404);
    expect(await fieldCount(org.id)).toBe(before - 1);
    expect(await auditLog(org.id)).toContainEqual(expect.objectContaining({ action: 'delete', entity: 'field', entity_id: field.id }));
  });

  it('keeps a field with sightings on record: deleting it answers 409 with the count and removes nothing', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const { field, sightingIds } = await makeScoutedField(
      org,
      stopsFrom([TEST_FIELD_CORNER.lon + 0.001, TEST_FIELD_CORNER.lon + 0.002], [TEST_FIELD_CORNER.lat + 0.001, TEST_FIELD_CORNER.lat + 0.002], [4, 0]),
    );
    const res = await admin.delete(`/api/fields/${field.id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`${field.name} has 2 sightings on record, so it is kept; edit its boundary or details instead of deleting it.`);
    await admin.get(`/api/fields/${field.id}`).expect(200);
    const [{ kept }] = await sequelize.query<{ kept: number }>('SELECT count(*)::int AS kept FROM sightings WHERE id IN (:ids)', {
      replacements: { ids: sightingIds },
      type: QueryTypes.SELECT,
    });
    expect(kept).toBe(sightingIds.length);
  });

  it("edits a field's details and logs the change", async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const field = await createField(admin, (await createFarm(admin)).id, plainField(), { crop: 'soybean', season: 2026 });
    const res = await admin.patch(`/api/fields/${field.id}`, { crop: 'maize', season: 2027 }).expect(200);
    expect(res.body.field).toMatchObject({ crop: 'maize', season: 2027, name: field.name });
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({ action: 'update', entity: 'field', entity_id: field.id, changes: { crop: 'maize', season: 2027 } }),
    );
  });

  it('assigns a scout, who then sees the field; unassigning takes it away', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const field = await createField(admin, (await createFarm(admin)).id);
    const scout = await signedIn(org.users.scout.email);
    await scout.get(`/api/fields/${field.id}`).expect(404);

    await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id }).expect(204);
    expect((await admin.get(`/api/fields/${field.id}`).expect(200)).body.field.scoutIds).toEqual([org.users.scout.id]);
    await scout.get(`/api/fields/${field.id}`).expect(200);

    await admin.delete(`/api/fields/${field.id}/scouts/${org.users.scout.id}`).expect(204);
    await scout.get(`/api/fields/${field.id}`).expect(404);
    const log = await auditLog(org.id);
    expect(log).toContainEqual(expect.objectContaining({ action: 'assign-scout', entity_id: field.id, changes: { userId: org.users.scout.id } }));
    expect(log).toContainEqual(expect.objectContaining({ action: 'unassign-scout', entity_id: field.id }));
  });

  it('refuses to assign someone who is not a scout, saying so', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const field = await createField(admin, (await createFarm(admin)).id);
    const res = await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.grower.id });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe(`${org.users.grower.name} is not a scout; only scouts are assigned to fields.`);
    expect((await admin.get(`/api/fields/${field.id}`).expect(200)).body.field.scoutIds).toEqual([]);
  });

  it('links a grower, who then sees the farm and its fields; unlinking takes them away', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const farm = await createFarm(admin);
    const field = await createField(admin, farm.id);
    const grower = await signedIn(org.users.grower.email);
    expect((await grower.get('/api/farms').expect(200)).body.farms).toEqual([]);

    await admin.post(`/api/farms/${farm.id}/growers`, { userId: org.users.grower.id }).expect(204);
    expect((await admin.get(`/api/farms/${farm.id}`).expect(200)).body.farm.growerUserIds).toEqual([org.users.grower.id]);
    expect((await grower.get('/api/farms').expect(200)).body.farms.map((f: { id: string }) => f.id)).toEqual([farm.id]);
    await grower.get(`/api/fields/${field.id}`).expect(200);

    await admin.delete(`/api/farms/${farm.id}/growers/${org.users.grower.id}`).expect(204);
    await grower.get(`/api/farms/${farm.id}`).expect(404);
    await grower.get(`/api/fields/${field.id}`).expect(404);
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({ action: 'link-grower', entity_id: farm.id, changes: { userId: org.users.grower.id } }),
    );
  });

  it('refuses to link someone who is not a grower, saying so', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const farm = await createFarm(admin);
    const res = await admin.post(`/api/farms/${farm.id}/growers`, { userId: org.users.scout.id });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/is not a grower/);
  });
});

describe('pest library', () => {
  it('adds a pest with its threshold and source, and logs it', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const pest = await createPest(admin, {
      name: 'Test beetle',
      actionThreshold: 0.75,
      countUnit: 'beetles per plant',
      thresholdSource: 'Invented for this test',
    });
    expect(pest).toMatchObject({ name: 'Test beetle', kind: 'insect', actionThreshold: 0.75, thresholdBasis: 'mean', thresholdNote: '', active: true });
    expect((await admin.get('/api/pests').expect(200)).body.pests.map((p: { id: string }) => p.id)).toContain(pest.id);
    expect(await auditLog(org.id)).toContainEqual(expect.objectContaining({ action: 'create', entity: 'pest', entity_id: pest.id }));
  });

  it('edits one attribute and leaves the others as they were', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const pest = await createPest(admin, { thresholdBasis: 'incidence', thresholdNote: 'Share of plants infested', actionThreshold: 50 });
    const res = await admin.patch(`/api/pests/${pest.id}`, { actionThreshold: 40 }).expect(200);
    expect(res.body.pest).toEqual({ ...pest, actionThreshold: 40 });
    const log = await auditLog(org.id);
    expect(log).toContainEqual(
      expect.objectContaining({ action: 'update', entity: 'pest', entity_id: pest.id, changes: { before: pest, after: { actionThreshold: 40 } } }),
    );
  });

  it('deactivates a pest: it leaves the active list, keeps its details, and can be shown again', async () => {
    const { admin } = await adminOfNewOrganisation();
    const pest = await createPest(admin, { thresholdNote: 'Keep this note' });
    const res = await admin.patch(`/api/pests/${pest.id}`, { active: false }).expect(200);
    expect(res.body.pest).toEqual({ ...pest, active: false });
    const active = (await admin.get('/api/pests').expect(200)).body.pests.map((p: { id: string }) => p.id);
    const all = (await admin.get('/api/pests?includeInactive=true').expect(200)).body.pests.map((p: { id: string }) => p.id);
    expect(active).not.toContain(pest.id);
    expect(all).toContain(pest.id);
  });

  it('refuses an edit that changes nothing, and a threshold that is not a number', async () => {
    const { admin } = await adminOfNewOrganisation();
    const pest = await createPest(admin);
    const empty = await admin.patch(`/api/pests/${pest.id}`, {});
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/Change at least one detail/);
    const notANumber = await admin.patch(`/api/pests/${pest.id}`, { actionThreshold: 'lots' });
    expect(notANumber.status).toBe(400);
    expect(notANumber.body.error.fields.actionThreshold).toMatch(/as a number/);
  });
});

describe('users: role change and deactivation', () => {
  it("changes a role, which takes effect on the user's open session at once, and logs it", async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const scout = await signedIn(org.users.scout.email);
    await scout.get('/api/users').expect(403);
    const res = await admin.patch(`/api/users/${org.users.scout.id}`, { role: 'adviser' }).expect(200);
    expect(res.body.user.role).toBe('adviser');
    await scout.get('/api/users').expect(200);
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({
        action: 'update',
        entity: 'user',
        entity_id: org.users.scout.id,
        changes: expect.objectContaining({ after: { role: 'adviser' } }),
      }),
    );
  });

  it('deactivates a user: their open session stops working at once and they cannot sign in again', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const adviser = await signedIn(org.users.adviser.email);
    await adviser.get('/api/farms').expect(200);
    await admin.patch(`/api/users/${org.users.adviser.id}`, { active: false }).expect(200);
    await adviser.get('/api/farms').expect(401);
    expect((await adviser.get('/api/auth/me').expect(200)).body.user).toBeNull();
    await expect(signedIn(org.users.adviser.email)).rejects.toThrow(/401/);
    const sessions = await sequelize.query(`SELECT sid FROM session WHERE sess->'passport'->>'user' = :id`, {
      replacements: { id: org.users.adviser.id },
      type: QueryTypes.SELECT,
    });
    expect(sessions).toEqual([]);
    const listed = (await admin.get('/api/users').expect(200)).body.users.find((u: { id: string }) => u.id === org.users.adviser.id);
    expect(listed.active).toBe(false);
  });

  it('refuses to let an admin deactivate themself or change their own role', async () => {
    const { org, admin } = await adminOfNewOrganisation();
    const deactivate = await admin.patch(`/api/users/${org.users.admin.id}`, { active: false });
    expect(deactivate.status).toBe(400);
    expect(deactivate.body.error.message).toMatch(/cannot .*deactivate yourself/);
    const demote = await admin.patch(`/api/users/${org.users.admin.id}`, { role: 'scout' });
    expect(demote.status).toBe(400);
    const me = (await admin.get('/api/auth/me').expect(200)).body.user;
    expect(me).toMatchObject({ role: 'admin', active: true });
  });
});
