import crypto from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { sequelize } from '../../server/db.ts';
import { trustProxySetting } from '../../server/config.ts';
import { anonymous, signedIn, testApp } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD } from '../helpers/org.ts';
import { linkToken, messagesTo, waitForMessage } from '../helpers/mailbox.ts';

describe('sign-in and sign-out', () => {
  it('signs a user in, shows who they are, and signs them out', async () => {
    const org = await makeOrganisation();
    const client = await signedIn(org.users.adviser.email);
    const me = await client.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email: org.users.adviser.email, role: 'adviser' });
    expect(me.body.user.passwordHash).toBeUndefined();
    await client.post('/api/auth/sign-out').expect(204);
    expect((await client.get('/api/auth/me')).body.user).toBeNull();
  });

  it('refuses a wrong password with the same message as an unknown address', async () => {
    const org = await makeOrganisation();
    const wrong = await (await anonymous()).post('/api/auth/sign-in', { email: org.users.scout.email, password: 'not-the-password' });
    const unknown = await (await anonymous()).post('/api/auth/sign-in', { email: 'nobody-here@test.example', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
  });

  it('gives a new session id at sign-in', async () => {
    const org = await makeOrganisation();
    const client = await anonymous();
    const before = await client.get('/api/auth/csrf');
    const cookieBefore = String(before.headers['set-cookie'] ?? '');
    const res = await client.post('/api/auth/sign-in', { email: org.users.admin.email, password: TEST_PASSWORD }).expect(200);
    const cookieAfter = String(res.headers['set-cookie']);
    expect(cookieAfter).toMatch(/patchwise\.sid=/);
    expect(cookieAfter.split(';')[0]).not.toBe(cookieBefore.split(';')[0]);
    expect(cookieAfter).toMatch(/HttpOnly/i);
    expect(cookieAfter).toMatch(/SameSite=Lax/i);
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const org = await makeOrganisation();
    const client = await signedIn(org.users.admin.email);
    const res = await client.agent.post('/api/farms').send({ name: 'No token farm', contacts: [] });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });

  it('stops sign-in attempts after the limit', async () => {
    const org = await makeOrganisation();
    const client = await anonymous();
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      statuses.push((await client.post('/api/auth/sign-in', { email: org.users.grower.email, password: `wrong-${i}` })).status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.at(-1)).toBe(429);
  });
});

describe('invitations and password resets', () => {
  it('invites a user by e-mail; the link sets a password once', async () => {
    const org = await makeOrganisation();
    const admin = await signedIn(org.users.admin.email);
    const email = `new-scout-${org.id.slice(0, 8)}@test.example`;
    const invited = await admin.post('/api/users', { name: 'New Scout', email, role: 'scout' }).expect(202);
    expect(invited.body).toEqual({ message: `An invitation is on its way to ${email}.` });
    const listed = (await admin.get('/api/users').expect(200)).body.users.find((u: { email: string }) => u.email === email);
    expect(listed.invited).toBe(true);

    const [message] = await waitForMessage(email);
    expect(message.subject).toContain(org.name);
    const token = linkToken(message);

    const visitor = await anonymous();
    await visitor.post('/api/auth/set-password', { token, password: 'a-long-new-password' }).expect(200);
    await signedIn(email, 'a-long-new-password');

    const again = await (await anonymous()).post('/api/auth/set-password', { token, password: 'another-long-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.message).toMatch(/expired or was already used/);
  });

  it('sends a reset link to a known address and answers the same for an unknown one', async () => {
    const org = await makeOrganisation();
    const client = await anonymous();
    const known = await client.post('/api/auth/forgot-password', { email: org.users.grower.email });
    const unknown = await client.post('/api/auth/forgot-password', { email: 'nobody-at-all@test.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);

    const [message] = await waitForMessage(org.users.grower.email);
    await client.post('/api/auth/set-password', { token: linkToken(message), password: 'grower-new-password' }).expect(200);
    await signedIn(org.users.grower.email, 'grower-new-password');
    expect(await messagesTo('nobody-at-all@test.example')).toHaveLength(0);
  });

  it('refuses a short password with a message that says what to fix', async () => {
    const res = await (await anonymous()).post('/api/auth/set-password', { token: 'x'.repeat(40), password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/at least 12 characters/);
  });
});

describe('sign-in limits that a client cannot dodge', () => {
  it('ignores X-Forwarded-For unless a proxy is configured: a new header value is not a new bucket', async () => {
    const org = await makeOrganisation();
    const client = await anonymous();
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) {
      const res = await client.agent
        .post('/api/auth/sign-in')
        .set('x-csrf-token', client.csrf)
        .set('X-Forwarded-For', `198.51.100.${i + 1}`)
        .send({ email: org.users.scout.email, password: `wrong-${i}` });
      statuses.push(res.status);
    }
    expect(statuses.at(-1)).toBe(429);
  });

  it('stops failed sign-ins from one address across many e-mail addresses', async () => {
    const { app, limit, restore } = await proxiedApp();
    try {
      // 203.0.113.0/24 is TEST-NET-3 (RFC 5737): an address no other test signs in from.
      const address = `203.0.113.${1 + Math.floor(Math.random() * 250)}`;
      const statuses: number[] = [];
      for (let i = 0; i <= limit; i++) {
        const visitor = request.agent(app);
        const csrf = (await visitor.get('/api/auth/csrf').set('X-Forwarded-For', address)).body.csrfToken;
        const res = await visitor
          .post('/api/auth/sign-in')
          .set('x-csrf-token', csrf)
          .set('X-Forwarded-For', address)
          .send({ email: `guess-${i}-${crypto.randomUUID()}@test.example`, password: 'not-the-password' });
        statuses.push(res.status);
      }
      expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
      expect(statuses.at(-1)).toBe(429);
      const stored = await sequelize.query<{ hits: number }>('SELECT hits FROM request_limit_hits WHERE key = :key', {
        replacements: { key: `sign-in-address|${address}` },
        type: QueryTypes.SELECT,
      });
      expect(stored[0]?.hits).toBeGreaterThanOrEqual(limit);
    } finally {
      restore();
    }
  });
});

describe('TRUST_PROXY', () => {
  // Express's documented `trust proxy` values: a boolean, a hop count, or addresses and subnets (expressjs.com, "Express behind proxies").
  it.each([
    [undefined, false],
    ['', false],
    ['off', false],
    ['1', 1],
    ['loopback', 'loopback'],
    ['10.0.0.0/8, 192.168.1.1', '10.0.0.0/8, 192.168.1.1'],
    ['true', true],
  ] as const)('reads %j as %j', (value, expected) => {
    expect(trustProxySetting(value)).toBe(expected);
  });
});

/** The app as it runs behind one trusted proxy on loopback, with the per-address limit lowered for the test. */
async function proxiedApp() {
  const { createApp } = await import('../../server/app.ts');
  const { config } = await import('../../server/config.ts');
  const saved = { trustProxy: config.trustProxy, signInAddressLimitPerWindow: config.signInAddressLimitPerWindow };
  config.trustProxy = 'loopback';
  config.signInAddressLimitPerWindow = 6;
  const app = createApp();
  return { app, limit: 6, restore: () => Object.assign(config, saved) };
}

describe('a new password ends the other sessions', () => {
  it('signs out every other session of the account when its password is reset', async () => {
    const org = await makeOrganisation();
    const elsewhere = await signedIn(org.users.adviser.email);
    const here = await signedIn(org.users.adviser.email);
    await here.post('/api/auth/forgot-password', { email: org.users.adviser.email }).expect(202);
    const [message] = await waitForMessage(org.users.adviser.email);
    await here.post('/api/auth/set-password', { token: linkToken(message), password: 'Heron-thistle-granary-42' }).expect(200);

    expect((await elsewhere.get('/api/auth/me')).body.user).toBeNull();
    expect((await here.get('/api/auth/me')).body.user).toMatchObject({ email: org.users.adviser.email });
    await signedIn(org.users.adviser.email, 'Heron-thistle-granary-42');
  });
});

describe('passwords that are easy to guess', () => {
  // "password" heads every published list of common passwords; zxcvbn-ts ships such lists as its dictionaries.
  it.each(['password1234', 'qwertyuiop12', 'aaaaaaaaaaaa'])('refuses %s with what to do instead, and the link still works after', async (weak) => {
    const org = await makeOrganisation();
    await (await anonymous()).post('/api/auth/forgot-password', { email: org.users.scout.email }).expect(202);
    const token = linkToken((await waitForMessage(org.users.scout.email))[0]);
    const visitor = await anonymous();
    const res = await visitor.post('/api/auth/set-password', { token, password: weak });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/too easy to guess.*use four or more unrelated words/);
    await visitor.post('/api/auth/set-password', { token, password: 'Larch-ember-pasture-road' }).expect(200);
  });

  it("refuses a password made of the person's own e-mail address", async () => {
    const org = await makeOrganisation();
    await (await anonymous()).post('/api/auth/forgot-password', { email: org.users.grower.email }).expect(202);
    const token = linkToken((await waitForMessage(org.users.grower.email))[0]);
    const res = await (await anonymous()).post('/api/auth/set-password', { token, password: org.users.grower.email });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/too easy to guess/);
  });
});

describe('anonymous visitors', () => {
  it('get a CSRF token without a session row or a session cookie, and the token still guards their requests', async () => {
    const visitor = request.agent(testApp());
    const res = await visitor.get('/api/auth/csrf').expect(200);
    expect(String(res.headers['set-cookie'] ?? '')).not.toMatch(/patchwise\.sid=/);
    const rows = await sequelize.query('SELECT sid FROM session WHERE sess::text LIKE :token', {
      replacements: { token: `%${res.body.csrfToken}%` },
      type: QueryTypes.SELECT,
    });
    expect(rows).toEqual([]);
    await visitor.post('/api/auth/forgot-password').send({ email: 'nobody@test.example' }).expect(403);
    await visitor.post('/api/auth/forgot-password').set('x-csrf-token', 'made-up').send({ email: 'nobody@test.example' }).expect(403);
    await visitor.post('/api/auth/forgot-password').set('x-csrf-token', res.body.csrfToken).send({ email: 'nobody@test.example' }).expect(202);
    const other = request.agent(testApp());
    await other.post('/api/auth/forgot-password').set('x-csrf-token', res.body.csrfToken).send({ email: 'nobody@test.example' }).expect(403);
  });
});

describe('links left over after a new password', () => {
  it('stops an older invitation link from working once a reset link has set the password', async () => {
    const org = await makeOrganisation();
    const admin = await signedIn(org.users.admin.email);
    const email = `both-links-${org.id.slice(0, 8)}@test.example`;
    await admin.post('/api/users', { name: 'Two Links', email, role: 'scout' }).expect(202);
    const invitation = linkToken((await waitForMessage(email))[0]);
    await (await anonymous()).post('/api/auth/forgot-password', { email }).expect(202);
    const reset = linkToken((await waitForMessage(email, 2))[1]);
    await (await anonymous()).post('/api/auth/set-password', { token: reset, password: 'Sorrel-kestrel-furrow-88' }).expect(200);

    const stale = await (await anonymous()).post('/api/auth/set-password', { token: invitation, password: 'Another-quince-meadow-19' });
    expect(stale.status).toBe(400);
    expect(stale.body.error.code).toBe('link_expired');
    await signedIn(email, 'Sorrel-kestrel-furrow-88');
  });
});
