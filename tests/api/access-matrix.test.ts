// Every foundation route × every kind of caller → the status the server must answer.
// Adding a route is one `row(...)` line; later route files can build their own table from tests/helpers/access-matrix.ts.
import { beforeAll, describe, expect, it } from 'vitest';
import { adminOnly, anySignedIn, buildAccessWorld, everyone, row, statusesFor, type AccessWorld } from '../helpers/access-matrix.ts';
import { plainField } from '../helpers/boundary-shapes.ts';

const staff = { scout: 403, grower: 403 } as const;
const newPest = { name: '{newName}', kind: 'weed', countUnit: 'plants per m²', actionThreshold: 1, thresholdSource: 'Matrix test value' };

const foundationRoutes = [
  row('GET', '/api/auth/me', everyone(200)),
  row('GET', '/api/config', everyone(200)),

  row('GET', '/api/users', anySignedIn(200, staff)),
  row('POST', '/api/users', adminOnly(201, 201), { name: 'Matrix Scout', email: '{newEmail}', role: 'scout' }, 'each admin invites into their own organisation'),
  row('PATCH', '/api/users/{invitedUser}', adminOnly(200), { name: 'Invited Adviser Renamed' }),
  row('POST', '/api/users/{invitedUser}/invitation', adminOnly(200)),

  row('GET', '/api/farms', anySignedIn(200)),
  row('GET', '/api/farms/{linkedFarm}', anySignedIn(200, { otherAdmin: 404 }), undefined, 'the scout has a field on it, the grower is linked'),
  row('GET', '/api/farms/{unlinkedFarm}', anySignedIn(200, { grower: 404, otherAdmin: 404 }), undefined, 'the scout has a field on it'),
  row('GET', '/api/farms/{hiddenFarm}', anySignedIn(200, { scout: 404, grower: 404, otherAdmin: 404 })),
  row('POST', '/api/farms', adminOnly(201, 201), { name: '{newName}', contacts: [] }),
  row('PUT', '/api/farms/{hiddenFarm}', adminOnly(200), { name: 'Hidden farm renamed', contacts: [] }),
  row('DELETE', '/api/farms/{newFarm}', adminOnly(204)),
  row('POST', '/api/farms/{linkedFarm}/growers', adminOnly(204), { userId: '{grower}' }),
  row('DELETE', '/api/farms/{newFarm}/growers/{grower}', adminOnly(204)),

  row('GET', '/api/fields', anySignedIn(200)),
  row('GET', '/api/fields?farmId={linkedFarm}', anySignedIn(200)),
  row('GET', '/api/fields/{assignedField}', anySignedIn(200, { otherAdmin: 404 })),
  row('GET', '/api/fields/{growerOnlyField}', anySignedIn(200, { scout: 404, otherAdmin: 404 })),
  row('GET', '/api/fields/{scoutOnlyField}', anySignedIn(200, { grower: 404, otherAdmin: 404 })),
  row('GET', '/api/fields/{hiddenField}', anySignedIn(200, { scout: 404, grower: 404, otherAdmin: 404 })),
  row('POST', '/api/fields', adminOnly(201, 400), { farmId: '{hiddenFarm}', name: '{newName}', crop: 'maize', season: 2026, boundary: plainField(6) }, "another organisation's farm id in the body is refused as not one of your farms"),
  row('PATCH', '/api/fields/{hiddenField}', adminOnly(200), { crop: 'winter wheat' }),
  row('DELETE', '/api/fields/{newField}', adminOnly(204)),
  row('POST', '/api/fields/{assignedField}/scouts', adminOnly(204), { userId: '{scout}' }),
  row('DELETE', '/api/fields/{newField}/scouts/{scout}', adminOnly(204)),

  row('GET', '/api/pests', anySignedIn(200)),
  row('GET', '/api/pests?includeInactive=true', anySignedIn(200)),
  row('POST', '/api/pests', adminOnly(201, 201), newPest),
  row('PATCH', '/api/pests/{pest}', adminOnly(200), { thresholdNote: 'Checked in the matrix' }),

  row('GET', '/api/mailbox', adminOnly(200, 200), undefined, 'each admin reads their own organisation\'s mail'),
  row('GET', '/api/mailbox/{invitationMessage}', adminOnly(200)),
  row('GET', '/api/mailbox/{invitationMessage}/attachments/0', adminOnly(404), undefined, 'an invitation carries no attachment'),

  row('GET', '/api/fields/{foreignField}', anySignedIn(404, { otherAdmin: 200 })),
  row('GET', '/api/farms/{foreignFarm}', anySignedIn(404, { otherAdmin: 200 })),
  row('PATCH', '/api/pests/{foreignPest}', adminOnly(404, 200), { thresholdNote: 'Guessed id' }, 'the home admin guesses the other organisation\'s pest id'),
  row('POST', '/api/fields/{assignedField}/scouts', adminOnly(404), { userId: '{foreignScout}' }, "another organisation's scout cannot be assigned"),
  row('POST', '/api/farms/{linkedFarm}/growers', adminOnly(404), { userId: '{foreignGrower}' }, "another organisation's grower cannot be linked"),
  row('PATCH', '/api/users/{foreignScout}', adminOnly(404, 200), { name: 'Renamed across organisations' }, 'the home admin guesses the other organisation\'s user id'),
];

describe('access matrix: every foundation route for every caller', () => {
  let world: AccessWorld;
  beforeAll(async () => {
    world = await buildAccessWorld();
  });

  it.each(foundationRoutes)('$method $path answers each caller as expected', async (entry) => {
    expect(await statusesFor(entry, world)).toEqual(entry.expected);
  });
});

describe("listings never show another organisation's rows", () => {
  let world: AccessWorld;
  beforeAll(async () => {
    world = await buildAccessWorld();
  });

  const listings = [
    ['/api/users', 'users'],
    ['/api/farms', 'farms'],
    ['/api/fields', 'fields'],
    ['/api/pests?includeInactive=true', 'pests'],
    ['/api/mailbox', 'messages'],
  ] as const;

  it.each(listings)('%s shows the other organisation none of the home rows', async (url, key) => {
    const homeRows = (await world.clients.admin.get(url).expect(200)).body[key] as Array<{ id: string | number; organisationId?: string }>;
    const otherRows = (await world.clients.otherAdmin.get(url).expect(200)).body[key] as Array<{ id: string | number; organisationId?: string }>;
    expect(homeRows.length).toBeGreaterThan(0);
    const otherIds = new Set(otherRows.map((r) => String(r.id)));
    expect(homeRows.filter((r) => otherIds.has(String(r.id)))).toEqual([]);
  });

  it("a user listing holds only the caller's organisation", async () => {
    const users = (await world.clients.adviser.get('/api/users').expect(200)).body.users as Array<{ organisationId: string }>;
    expect(new Set(users.map((u) => u.organisationId))).toEqual(new Set([world.home.id]));
  });

  it('a scout lists only the fields assigned to them, and only those fields\' farms', async () => {
    const fields = (await world.clients.scout.get('/api/fields').expect(200)).body.fields as Array<{ id: string }>;
    const farms = (await world.clients.scout.get('/api/farms').expect(200)).body.farms as Array<{ id: string }>;
    expect(fields.map((f) => f.id).sort()).toEqual([world.ids.assignedField, world.ids.scoutOnlyField].sort());
    expect(farms.map((f) => f.id).sort()).toEqual([world.ids.linkedFarm, world.ids.unlinkedFarm].sort());
  });

  it('a grower lists only linked farms and the fields on them', async () => {
    const fields = (await world.clients.grower.get('/api/fields').expect(200)).body.fields as Array<{ id: string }>;
    const farms = (await world.clients.grower.get('/api/farms').expect(200)).body.farms as Array<{ id: string }>;
    expect(farms.map((f) => f.id)).toEqual([world.ids.linkedFarm]);
    expect(fields.map((f) => f.id).sort()).toEqual([world.ids.assignedField, world.ids.growerOnlyField].sort());
  });

  it("a scout does not see farm contacts' e-mail addresses", async () => {
    const farm = (await world.clients.scout.get(`/api/farms/${world.ids.linkedFarm}`).expect(200)).body.farm;
    expect(farm.contacts).toEqual([]);
  });
});
