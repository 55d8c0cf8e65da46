import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { signedIn } from '../helpers/http.ts';

const sessionExpiry = async (userId: string) =>
  sequelize.query<{ expire: Date }>(`SELECT expire FROM session WHERE sess->'passport'->>'user' = :userId`, {
    replacements: { userId },
    type: QueryTypes.SELECT,
  });

describe('the signed-in user on each request', () => {
  it('is read afresh: an account switched off in the database is refused on its very next request, session row and all', async () => {
    const org = await makeOrganisation();
    const adviser = await signedIn(org.users.adviser.email);
    await adviser.get('/api/pests').expect(200);
    // Straight in the table, not through the service that also drops the sessions: only the per-request read can catch it.
    await sequelize.query('UPDATE users SET active = false WHERE id = :id', { replacements: { id: org.users.adviser.id } });
    expect(await sessionExpiry(org.users.adviser.id)).toHaveLength(1);
    await adviser.get('/api/pests').expect(401);
    // The refused session forgot its user for good: switching the account back on does not revive it.
    await sequelize.query('UPDATE users SET active = true WHERE id = :id', { replacements: { id: org.users.adviser.id } });
    await adviser.get('/api/pests').expect(401);
    await (await signedIn(org.users.adviser.email)).get('/api/pests').expect(200);
  });

  it('takes a role change from the database on the next request', async () => {
    const org = await makeOrganisation();
    const scout = await signedIn(org.users.scout.email);
    await scout.get('/api/users').expect(403);
    await sequelize.query(`UPDATE users SET role = 'admin' WHERE id = :id`, { replacements: { id: org.users.scout.id } });
    await scout.get('/api/users').expect(200);
  });
});

describe('reads and the session row', () => {
  it('leave the stored expiry where sign-in put it (a working day, not rolled by each read)', async () => {
    const org = await makeOrganisation();
    const grower = await signedIn(org.users.grower.email);
    const [before] = await sessionExpiry(org.users.grower.id);
    await new Promise((resolve) => setTimeout(resolve, 1100));
    await grower.get('/api/auth/me').expect(200);
    await grower.get('/api/config').expect(200);
    const [after] = await sessionExpiry(org.users.grower.id);
    expect(after.expire.getTime()).toBe(before.expire.getTime());
    // The row's expiry is the cookie's 12 hours from sign-in, within the test's own run time.
    expect(before.expire.getTime() - Date.now()).toBeGreaterThan(11.9 * 3600 * 1000);
    expect(before.expire.getTime() - Date.now()).toBeLessThanOrEqual(12 * 3600 * 1000);
  });
});
