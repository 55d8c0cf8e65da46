import { describe, expect, it } from 'vitest';
import { anonymous, signedIn } from '../helpers/http.ts';
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
    const invited = await admin.post('/api/users', { name: 'New Scout', email, role: 'scout' }).expect(201);
    expect(invited.body.user.invited).toBe(true);

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
