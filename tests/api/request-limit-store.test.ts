// The sign-in limit's counts live in PostgreSQL: a store that has never seen a client (another app process, or
// the same one after a restart) reads the same count, concurrent attempts each count, and a window runs out.
import crypto from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { Options } from 'express-rate-limit';
import { PostgresRequestLimitStore } from '../../server/auth/request-limit-store.ts';
import { anonymous } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';

const storeWithWindow = (prefix: string, windowMs: number) => {
  const store = new PostgresRequestLimitStore(prefix);
  store.init({ windowMs } as Options);
  return store;
};

describe('sign-in limit counts in PostgreSQL', () => {
  it('failed sign-ins through the app are counted where a fresh store (a second process) reads them', async () => {
    const org = await makeOrganisation();
    const client = await anonymous();
    for (let i = 0; i < 3; i++) await client.post('/api/auth/sign-in', { email: org.users.scout.email, password: `wrong-${i}` }).expect(401);
    // supertest connects over IPv4 loopback; the key is the address, then the e-mail in lower case.
    const seen = await storeWithWindow('sign-in|', 15 * 60_000).get(`127.0.0.1|${org.users.scout.email.toLowerCase()}`);
    expect(seen?.totalHits).toBe(3);
    expect(seen!.resetTime!.getTime()).toBeGreaterThan(Date.now());
  });

  it('concurrent attempts from one client each get their own count', async () => {
    const store = storeWithWindow('test|', 60_000);
    const key = crypto.randomUUID();
    const results = await Promise.all(Array.from({ length: 20 }, () => store.increment(key)));
    expect(results.map((r) => r.totalHits).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    await store.decrement(key);
    expect((await store.get(key))?.totalHits).toBe(19);
    await store.resetKey(key);
    expect(await store.get(key)).toBeUndefined();
  });

  it('a window that has run out starts again from one; two prefixes never share a count', async () => {
    const key = crypto.randomUUID();
    const short = storeWithWindow('short|', 300);
    const other = storeWithWindow('other|', 60_000);
    await short.increment(key);
    expect((await short.increment(key)).totalHits).toBe(2);
    expect((await other.increment(key)).totalHits).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 400));
    expect(await short.get(key)).toBeUndefined();
    expect((await short.increment(key)).totalHits).toBe(1);
  });
});
