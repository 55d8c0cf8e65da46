// PostgreSQL stopped and started again while the app serves requests: 503 with a sentence during the outage,
// recovery without a restart of the app, and no request half-applied. Uses the one throwaway cluster `npm test`
// starts, and always leaves it running for the suites after this one.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { clusterFor, isRunning, startCluster, stopCluster, type Cluster } from '../../scripts/lib/postgres.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';

function testCluster(): Cluster {
  const tmp = process.env.PATCHWISE_TEST_TMP;
  const url = process.env.DATABASE_URL;
  if (!tmp || !url) throw new Error('run this suite through `npm test`, which starts the throwaway cluster');
  return clusterFor(`${tmp}/postgres`, Number(new URL(url).port));
}

async function until<T>(what: string, probe: () => Promise<T | null>, timeoutMs = 60_000): Promise<T> {
  const started = Date.now();
  for (;;) {
    const value = await probe().catch(() => null);
    if (value !== null) return value;
    if (Date.now() - started > timeoutMs) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

const farmBody = (name: string) => ({
  name,
  contacts: [1, 2, 3].map((i) => ({ name: `Contact ${i}`, email: `c${i}-${name.replace(/\W/g, '').toLowerCase()}@farm.example` })),
});

describe('a database restart while serving', () => {
  const cluster = testCluster();
  let org: TestOrganisation;
  let admin: Client;

  beforeAll(async () => {
    org = await makeOrganisation('Outage');
    admin = await signedIn(org.users.admin.email);
    await admin.post('/api/farms', farmBody(`Before ${org.id.slice(0, 6)}`)).expect(201);
  });

  afterAll(() => {
    if (!isRunning(cluster)) startCluster(cluster);
  });

  it('answers 503 with a sentence during the outage, recovers by itself, and applies each request whole or not at all', async () => {
    const visitor = await anonymous();
    // Requests in flight as the database goes down: each makes a farm and its three contacts in one transaction.
    const names = Array.from({ length: 12 }, (_, i) => `Race ${org.id.slice(0, 6)} ${i}`);
    let during: Array<{ status: number; body: { error?: { code: string; message: string } } }>;
    let visitorAsksWhoItIs: { status: number; body: { user?: unknown } };
    try {
      const racing = names.map((name) => admin.post('/api/farms', farmBody(name)).then((r) => r.status));
      stopCluster(cluster);
      const raced = await Promise.all(racing);
      expect(raced.every((s) => s === 201 || s === 503)).toBe(true);

      during = [
        await admin.get('/api/fields'),
        await admin.post('/api/farms', farmBody(`During ${org.id.slice(0, 6)}`)),
        await visitor.post('/api/auth/sign-in', { email: org.users.adviser.email, password: 'whatever-it-is' }),
      ];
      visitorAsksWhoItIs = await visitor.get('/api/auth/me');
    } finally {
      if (!isRunning(cluster)) startCluster(cluster);
    }
    for (const res of during) {
      expect(res.status).toBe(503);
      expect(res.body.error).toEqual({ code: 'unavailable', message: 'Patchwise cannot reach its database right now; try again in a minute.' });
    }
    // A visitor without a session has nothing to look up, so the answer needs no database.
    expect(visitorAsksWhoItIs!.status).toBe(200);
    expect(visitorAsksWhoItIs!.body.user).toBeNull();

    // The same app and the same signed-in session work again without a restart.
    const fields = await until('the API to answer again', async () => {
      const res = await admin.get('/api/fields');
      return res.status === 200 ? res : null;
    });
    expect(fields.body.fields).toEqual([]);
    await admin.post('/api/farms', farmBody(`After ${org.id.slice(0, 6)}`)).expect(201);

    const farms = await sequelize.query<{ name: string; contacts: number }>(
      `SELECT f.name, (SELECT count(*)::int FROM farm_contacts c WHERE c.farm_id = f.id) AS contacts FROM farms f WHERE f.organisation_id = :org`,
      { replacements: { org: org.id }, type: QueryTypes.SELECT },
    );
    expect(farms.every((f) => f.contacts === 3)).toBe(true);
    expect(farms.some((f) => f.name.startsWith('During'))).toBe(false);
    expect(farms.map((f) => f.name)).toEqual(expect.arrayContaining([`Before ${org.id.slice(0, 6)}`, `After ${org.id.slice(0, 6)}`]));
  });
});
