// A threshold is marked for the admin to confirm until they have checked it against its source: the admin's
// confirmation sets the mark, an edit of the value or source clears it again, and the threshold status the
// adviser reads carries it.
import { describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { auditLog, createPest } from '../helpers/farm-records.ts';
import { addSightings, makeField, makeWalk, TEST_FIELD_CORNER } from '../helpers/sightings.ts';

async function organisationWithAdmin() {
  const org = await makeOrganisation('Confirm');
  return { org, admin: await signedIn(org.users.admin.email) };
}

describe("confirming a pest's threshold", () => {
  it('starts unconfirmed, and the admin confirms it; the confirmation is logged', async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin);
    expect(pest.thresholdConfirmed).toBe(false);
    const res = await admin.patch(`/api/pests/${pest.id}`, { thresholdConfirmed: true }).expect(200);
    expect(res.body.pest).toEqual({ ...pest, thresholdConfirmed: true });
    expect(await auditLog(org.id)).toContainEqual(
      expect.objectContaining({ action: 'update', entity: 'pest', entity_id: pest.id, changes: { before: pest, after: { thresholdConfirmed: true } } }),
    );
  });

  it.each([
    ['the value', { actionThreshold: 300 }],
    ['the source', { thresholdSource: 'A different bulletin, 2024' }],
    ['what the value applies to', { thresholdBasis: 'incidence' }],
    ['the count unit', { countUnit: 'aphids per leaf' }],
  ])('asks for confirmation again when the admin edits %s', async (_what, change) => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { thresholdConfirmed: true });
    expect(pest.thresholdConfirmed).toBe(true);
    const res = await admin.patch(`/api/pests/${pest.id}`, change).expect(200);
    expect(res.body.pest).toEqual({ ...pest, ...change, thresholdConfirmed: false });
  });

  it('keeps the confirmation when an edit leaves value and source as they were', async () => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin, { thresholdConfirmed: true });
    // What the edit form sends: every detail, the threshold as typed, with only the note and crops changed.
    const res = await admin
      .patch(`/api/pests/${pest.id}`, {
        name: pest.name,
        actionThreshold: String(pest.actionThreshold),
        thresholdSource: pest.thresholdSource,
        thresholdNote: 'Checked against the bulletin',
        crops: ['soybean'],
      })
      .expect(200);
    expect(res.body.pest.thresholdConfirmed).toBe(true);
  });

  it('refuses to confirm a new value in the same edit, saying what to do, and changes nothing', async () => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin);
    const res = await admin.patch(`/api/pests/${pest.id}`, { actionThreshold: 12, thresholdConfirmed: true });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe('Save the new threshold first, then confirm it against its source.');
    const stored = (await admin.get('/api/pests').expect(200)).body.pests.find((p: { id: string }) => p.id === pest.id);
    expect(stored).toEqual(pest);
  });

  it('refuses a confirmation that is not true or false', async () => {
    const { admin } = await organisationWithAdmin();
    const pest = await createPest(admin);
    const res = await admin.patch(`/api/pests/${pest.id}`, { thresholdConfirmed: 'yes' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.thresholdConfirmed).toBe('Say whether the threshold is confirmed (true or false).');
  });

  it('does not let an adviser or a scout confirm a threshold', async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin);
    for (const role of ['adviser', 'scout'] as const) {
      const someone = await signedIn(org.users[role].email);
      expect((await someone.patch(`/api/pests/${pest.id}`, { thresholdConfirmed: true })).status).toBe(403);
    }
    const stored = (await admin.get('/api/pests').expect(200)).body.pests.find((p: { id: string }) => p.id === pest.id);
    expect(stored.thresholdConfirmed).toBe(false);
  });

  it("carries the mark in the adviser's threshold status and attention list until the admin confirms", async () => {
    const { org, admin } = await organisationWithAdmin();
    const pest = await createPest(admin);
    const field = await makeField(org);
    const walkId = await makeWalk(org, field.id);
    const { lon, lat } = TEST_FIELD_CORNER;
    await addSightings(
      org,
      { fieldId: field.id, walkId, pestId: pest.id },
      [0, 1, 2, 3, 4, 5].map((i) => ({ lon: lon + 0.0005 * (i + 1), lat: lat + 0.001, count: i })),
    );
    const adviser = await signedIn(org.users.adviser.email);
    const before = await adviser.get(`/api/fields/${field.id}/threshold-status?pestId=${pest.id}`).expect(200);
    expect(before.body.statuses.map((s: { thresholdConfirmed: boolean }) => s.thresholdConfirmed)).toEqual([false]);
    const attentionMarks = async () =>
      ((await adviser.get('/api/advisers/attention').expect(200)).body.notYetChecked as Array<{ fieldId: string; thresholdConfirmed: boolean }>)
        .filter((line) => line.fieldId === field.id)
        .map((line) => line.thresholdConfirmed);
    expect(await attentionMarks()).toEqual([false]);
    await admin.patch(`/api/pests/${pest.id}`, { thresholdConfirmed: true }).expect(200);
    const after = await adviser.get(`/api/fields/${field.id}/threshold-status?pestId=${pest.id}`).expect(200);
    expect(after.body.statuses.map((s: { thresholdConfirmed: boolean }) => s.thresholdConfirmed)).toEqual([true]);
    expect(await attentionMarks()).toEqual([true]);
  });
});
