// Reads with a read replica configured: a stand-in "replica" that never catches up (a second database, migrated but
// never written to) shows which reads go where. A person reads their own writes at once; other reads use the replica.
import { vi, afterAll, beforeAll, describe, expect, it } from 'vitest';

const LAGGING_DATABASE = 'patchwise_test_lagging_replica';
vi.hoisted(() => {
  // Before any server module reads its configuration.
  const replica = new URL(process.env.DATABASE_URL!);
  replica.pathname = '/patchwise_test_lagging_replica';
  process.env.DATABASE_REPLICA_URLS = replica.toString();
  process.env.REPLICA_CATCH_UP_SECONDS = '1';
});

import { execFileSync } from 'node:child_process';
import pg from 'pg';
import { readsFromPrimary } from '../../server/db-freshness.ts';
import { selectRows } from '../../server/queries/sql.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { signedIn } from '../helpers/http.ts';

async function onServer(sql: string) {
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = '/postgres';
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  await onServer(`DROP DATABASE IF EXISTS ${LAGGING_DATABASE} WITH (FORCE)`);
  await onServer(`CREATE DATABASE ${LAGGING_DATABASE}`);
  // The project's own migrate command (umzug loads the .ts migrations through tsx, which vitest's loader does not offer it).
  execFileSync('npx', ['tsx', 'scripts/migrate.ts'], { env: { ...process.env, DATABASE_URL: process.env.DATABASE_REPLICA_URLS }, stdio: 'pipe' });
});

afterAll(async () => {
  await onServer(`DROP DATABASE IF EXISTS ${LAGGING_DATABASE} WITH (FORCE)`);
});

const farmNames = (body: { farms: Array<{ name: string }> }) => body.farms.map((f) => f.name);

describe('with a read replica', () => {
  it('shows a farm to the admin who just created it, then reads from the replica once the catch-up time has passed', async () => {
    const org = await makeOrganisation();
    const admin = await signedIn(org.users.admin.email);
    await admin.post('/api/farms', { name: 'Replica Lane Farm', contacts: [] }).expect(201);

    const straightAfter = await admin.get('/api/farms').expect(200);
    expect(farmNames(straightAfter.body)).toContain('Replica Lane Farm');

    await new Promise((resolve) => setTimeout(resolve, 1_300));
    // The stand-in replica never received the farm: seeing it missing proves this read went to the replica.
    const later = await admin.get('/api/farms').expect(200);
    expect(farmNames(later.body)).not.toContain('Replica Lane Farm');
  });

  it('reads from the primary outside any request (a worker reading the rows just queued for it)', async () => {
    const org = await makeOrganisation();
    expect(readsFromPrimary()).toBe(true);
    const rows = await selectRows<{ id: string }>('SELECT id FROM organisations WHERE id = :id', { id: org.id });
    expect(rows).toHaveLength(1);
  });
});
