// Every sign-in attempt checks a password against an Argon2 hash, whatever the account's state, so the answer
// takes the same work for an unknown address, a wrong password and an invited account with no password yet
// (OWASP ASVS 4.0.3 V2.2 / WSTG-IDNT-04: no account enumeration through response time). The real verifier runs;
// the spy only counts its calls, since speed itself is measured in benchmarks, never asserted in tests.
import crypto from 'node:crypto';
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest';
import * as argon2 from '@node-rs/argon2';
import { stopQueue } from '../../server/jobs/queue.ts';
import { insertUser } from '../../server/queries/users.ts';
import { anonymous } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';

vi.mock('@node-rs/argon2', async (importOriginal) => {
  const real = await importOriginal<typeof import('@node-rs/argon2')>();
  return { ...real, verify: vi.fn(real.verify) };
});

afterAll(async () => {
  await stopQueue();
});

beforeEach(() => {
  vi.mocked(argon2.verify).mockClear();
});

async function signInAttempt(email: string) {
  const res = await (await anonymous()).post('/api/auth/sign-in', { email, password: 'Some-guess-at-a-password' });
  return { status: res.status, body: res.body, verifications: vi.mocked(argon2.verify).mock.calls.length };
}

describe('sign-in does the same work for every kind of failure', () => {
  it('verifies a hash for an invited account without a password, as for a wrong password and an unknown address', async () => {
    const org = await makeOrganisation('Hashing');
    // An invited account as an invitation leaves it: no password yet.
    const invitedEmail = `invited-${crypto.randomBytes(4).toString('hex')}@test.example`;
    await insertUser({ organisationId: org.id, name: 'Invited Scout', email: invitedEmail, role: 'scout', passwordHash: null });

    const attempts = [];
    for (const email of [invitedEmail, org.users.scout.email, `nobody-${crypto.randomBytes(4).toString('hex')}@test.example`]) {
      vi.mocked(argon2.verify).mockClear();
      attempts.push(await signInAttempt(email));
    }
    expect(attempts.map((a) => a.verifications)).toEqual([1, 1, 1]);
    expect(attempts.map((a) => a.status)).toEqual([401, 401, 401]);
    expect(attempts[0].body).toEqual(attempts[1].body);
    expect(attempts[0].body).toEqual(attempts[2].body);
  });
});
