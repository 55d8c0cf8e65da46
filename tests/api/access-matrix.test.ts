// Every foundation route × every kind of caller → the status the server must answer.
// The table lives in tests/helpers/access-routes.ts, beside the rows of every later route.
import { beforeAll, describe, expect, it } from 'vitest';
import { buildAccessWorld, statusesFor, type AccessWorld } from '../helpers/access-matrix.ts';
import { foundationRoutes } from '../helpers/access-routes.ts';

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

  it("a scout lists only the fields assigned to them, and only those fields' farms", async () => {
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
