// The pest library knows which crops each pest is scouted in: the admin sets and edits them, everyone in the
// organisation reads them, and a bad list is refused with a sentence and changes nothing.
import { describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { auditLog, createPest } from '../helpers/farm-records.ts';

async function organisationWithAdmin() {
  const org = await makeOrganisation('Crops');
  return { org, admin: await signedIn(org.users.admin.email) };
}

describe('crops of a pest', () => {
  it('stores the crops a pest is added with, and the scout reads them in the library', async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { crops: ['soybean', 'dry bean'] });
    expect(pest.crops).toEqual(['soybean', 'dry bean']);
    const scout = await signedIn(org.users.scout.email);
    const listed = (await scout.get('/api/pests').expect(200)).body.pests.find((p: { id: string }) => p.id === pest.id);
    expect(listed.crops).toEqual(['soybean', 'dry bean']);
  });

  it('keeps a crop once when it is listed twice in different case, with the first spelling', async () => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { crops: ['Corn', ' corn ', 'CORN', 'wheat'] });
    expect(pest.crops).toEqual(['Corn', 'wheat']);
  });

  it('starts a pest added without crops with none', async () => {
    const { admin } = await organisationWithAdmin();
    expect((await createPest(admin)).crops).toEqual([]);
  });

  it('replaces the crops on an edit, leaves the other details as they were, and logs the change', async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { crops: ['soybean'] });
    const res = await admin.patch(`/api/pests/${pest.id}`, { crops: ['corn', 'wheat'] }).expect(200);
    expect(res.body.pest).toEqual({ ...pest, crops: ['corn', 'wheat'] });
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({ action: 'update', entity: 'pest', entity_id: pest.id, changes: { before: pest, after: { crops: ['corn', 'wheat'] } } }),
    );
    const cleared = await admin.patch(`/api/pests/${pest.id}`, { crops: [] }).expect(200);
    expect(cleared.body.pest.crops).toEqual([]);
  });

  it('refuses crops that are not a list of names, saying what to fix, and keeps the stored crops', async () => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { crops: ['soybean'] });

    const text = await admin.patch(`/api/pests/${pest.id}`, { crops: 'soybean, corn' });
    expect(text.status).toBe(400);
    expect(text.body.error.fields.crops).toBe('List the crops as names, for example ["soybean", "corn"].');

    const blank = await admin.patch(`/api/pests/${pest.id}`, { crops: ['corn', '   '] });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields['crops.1']).toBe('A crop name cannot be empty.');

    const tooMany = await admin.patch(`/api/pests/${pest.id}`, { crops: Array.from({ length: 41 }, (_, i) => `crop ${i}`) });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields.crops).toBe('List at most 40 crops for one pest.');

    const stored = (await admin.get('/api/pests').expect(200)).body.pests.find((p: { id: string }) => p.id === pest.id);
    expect(stored.crops).toEqual(['soybean']);
  });

  it("does not let a scout change a pest's crops", async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { crops: ['soybean'] });
    const scout = await signedIn(org.users.scout.email);
    expect((await scout.patch(`/api/pests/${pest.id}`, { crops: ['corn'] })).status).toBe(403);
    const stored = (await admin.get('/api/pests').expect(200)).body.pests.find((p: { id: string }) => p.id === pest.id);
    expect(stored.crops).toEqual(['soybean']);
  });
});
