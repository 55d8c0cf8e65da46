// Security properties a user or an attacker would notice: CSRF on every state-changing route, session fixation,
// cookie flags, the sign-in limit, password rules, no user enumeration, escaped e-mail HTML, a script policy,
// path traversal through uploads and photo routes, injection through filters, and oversized bodies.
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import pg from 'pg';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { config } from '../../server/config.ts';
import { sessionCookieOptions, sessionMiddleware } from '../../server/auth/session.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { listApiRoutes } from '../helpers/access-matrix.ts';
import { createApp } from '../../server/app.ts';
import { anonymous, signedIn, testApp } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD } from '../helpers/org.ts';
import { linkToken, waitForMessage } from '../helpers/mailbox.ts';
import { makeJpeg, scoutingSetUp, uploadedFiles, uploadPhotos } from '../helpers/photos.ts';
import { acceptProposedZones, addContacts, makeCheckedField } from '../helpers/zones.ts';

const MARKUP = '<img src=x onerror=alert(1)>';
const sessionCookie = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('patchwise.sid='));

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

async function tableCounts() {
  const [row] = await sequelize.query<Record<string, number>>(
    `SELECT (SELECT count(*)::int FROM users) AS users, (SELECT count(*)::int FROM farms) AS farms, (SELECT count(*)::int FROM fields) AS fields,
            (SELECT count(*)::int FROM sightings) AS sightings, (SELECT count(*)::int FROM pests) AS pests, (SELECT count(*)::int FROM walks) AS walks`,
    { type: QueryTypes.SELECT },
  );
  return row;
}

describe('CSRF', () => {
  const stateChanging = listApiRoutes(testApp() as unknown as { router: { stack: unknown[] } }).filter(
    // The notice link's acknowledge and opened marks carry their credential in the path (server/app.ts says why).
    (r) => r.method !== 'GET' && !/^\/api\/notice-links\/:\w+\/(acknowledge|opened)$/.test(r.path),
  );

  it.each(stateChanging.map((r) => [`${r.method} ${r.path}`, r] as const))('%s refuses a signed-in request without the token', async (_label, route) => {
    const admin = await signedIn((await makeOrganisation('Csrf')).users.admin.email);
    const url = route.path.replace(/:\w+/g, crypto.randomUUID());
    const res = await admin.agent[route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete'](url).send({});
    expect(res.status).toBe(403);
    expect(res.body.error).toMatchObject({ code: 'csrf', message: expect.stringMatching(/reload the page/) });
  });

  it('refuses a token from another session', async () => {
    const org = await makeOrganisation('Csrf');
    const victim = await signedIn(org.users.admin.email);
    const attacker = await anonymous();
    const res = await victim.agent.post('/api/farms').set('x-csrf-token', attacker.csrf).send({ name: 'Forged farm', contacts: [] });
    expect(res.status).toBe(403);
  });
});

describe('sessions and cookies', () => {
  it('gives a new session id at sign-in, and the id planted before it is not signed in', async () => {
    const org = await makeOrganisation('Fixation');
    const client = await anonymous();
    const before = (await client.agent.get('/api/auth/csrf')).headers['set-cookie'];
    const planted = ([] as string[]).concat(before ?? []).find((c) => c.startsWith('patchwise.sid=')) ?? '';
    const signIn = await client.post('/api/auth/sign-in', { email: org.users.adviser.email, password: TEST_PASSWORD }).expect(200);
    const issued = sessionCookie(signIn)!;
    expect(issued).toBeTruthy();
    const plantedId = planted.split(';')[0];
    expect(issued.split(';')[0]).not.toBe(plantedId);
    if (plantedId) {
      const me = await request(testApp()).get('/api/auth/me').set('Cookie', plantedId);
      expect(me.body.user).toBeNull();
    }
  });

  it('sets the session cookie HttpOnly and SameSite=Lax, without Secure outside production', async () => {
    const org = await makeOrganisation('Cookie');
    const signIn = await (await anonymous()).post('/api/auth/sign-in', { email: org.users.scout.email, password: TEST_PASSWORD }).expect(200);
    const cookie = sessionCookie(signIn)!;
    expect(cookie).toMatch(/; HttpOnly/i);
    expect(cookie).toMatch(/; SameSite=Lax/i);
    expect(cookie).not.toMatch(/; Secure/i);
  });

  it('marks the cookie Secure with a production configuration, and sends it only over HTTPS', async () => {
    const production = { ...config, isProduction: true, isTest: false };
    expect(sessionCookieOptions(production)).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: true });
    // The real middleware with that configuration, behind a loopback proxy that says whether the request came over HTTPS.
    const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 1 });
    try {
      const app = express();
      app.set('trust proxy', 'loopback');
      app.use(sessionMiddleware(pool, { ...production, isTest: true }));
      app.get('/touch', (req, res) => {
        (req.session as unknown as { touched: boolean }).touched = true;
        res.end('ok');
      });
      const overHttps = await request(app).get('/touch').set('X-Forwarded-Proto', 'https');
      expect(sessionCookie(overHttps)).toMatch(/; Secure/i);
      expect(sessionCookie(overHttps)).toMatch(/; HttpOnly/i);
      const overHttp = await request(app).get('/touch');
      expect(sessionCookie(overHttp)).toBeUndefined();
    } finally {
      await pool.end();
    }
  });
});

describe('sign-in, passwords and enumeration', () => {
  it(`stops sign-in for that address after ${config.signInLimitPerWindow} failures, even with the right password`, async () => {
    const org = await makeOrganisation('Limit');
    const client = await anonymous();
    for (let i = 0; i < config.signInLimitPerWindow; i++) {
      expect((await client.post('/api/auth/sign-in', { email: org.users.scout.email, password: `wrong-${i}` })).status).toBe(401);
    }
    const blocked = await client.post('/api/auth/sign-in', { email: org.users.scout.email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/wait 15 minutes/);
    // Another address from the same place is not locked out.
    await signedIn(org.users.adviser.email);
  });

  it('answers a wrong password, an unknown address and a deactivated account with the same words', async () => {
    const org = await makeOrganisation('Enum');
    const admin = await signedIn(org.users.admin.email);
    await admin.patch(`/api/users/${org.users.grower.id}`, { active: false }).expect(200);
    const client = await anonymous();
    const wrong = await client.post('/api/auth/sign-in', { email: org.users.adviser.email, password: 'not-the-password' });
    const unknown = await client.post('/api/auth/sign-in', { email: `nobody-${org.id.slice(0, 8)}@test.example`, password: 'not-the-password' });
    const inactive = await client.post('/api/auth/sign-in', { email: org.users.grower.email, password: TEST_PASSWORD });
    for (const res of [wrong, unknown, inactive]) expect({ status: res.status, body: res.body }).toEqual({ status: wrong.status, body: wrong.body });
    expect(wrong.status).toBe(401);
  });

  it('answers a password reset for a known and an unknown address alike', async () => {
    const org = await makeOrganisation('Enum');
    const client = await anonymous();
    const known = await client.post('/api/auth/forgot-password', { email: org.users.scout.email });
    const unknown = await client.post('/api/auth/forgot-password', { email: `nobody-${org.id.slice(0, 8)}@test.example` });
    expect({ status: known.status, body: known.body }).toEqual({ status: unknown.status, body: unknown.body });
  });

  it('keeps the password rules: too short and too long are refused with what to fix, and the link still works after', async () => {
    const org = await makeOrganisation('Password');
    const admin = await signedIn(org.users.admin.email);
    const email = `rules-${org.id.slice(0, 8)}@test.example`;
    await admin.post('/api/users', { name: 'Rule Tester', email, role: 'scout' }).expect(202);
    const token = linkToken((await waitForMessage(email))[0]);
    const visitor = await anonymous();
    const short = await visitor.post('/api/auth/set-password', { token, password: 'elevenchars' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 12 characters/);
    const long = await visitor.post('/api/auth/set-password', { token, password: 'x'.repeat(201) });
    expect(long.body.error.fields.password).toMatch(/at most 200 characters/);
    await visitor.post('/api/auth/set-password', { token, password: 'twelve wrens' }).expect(200);
  });

  it("does not tell an admin that an address belongs to another organisation, and tells the address's owner instead", async () => {
    const home = await makeOrganisation('Inviter');
    const other = await makeOrganisation('Holder');
    const admin = await signedIn(home.users.admin.email);
    const fresh = await admin.post('/api/users', { name: 'Fresh Person', email: `fresh-${home.id.slice(0, 8)}@test.example`, role: 'grower' });
    const taken = await admin.post('/api/users', { name: 'Taken Person', email: other.users.grower.email, role: 'grower' });
    // The same status and the same answer, the address aside (OWASP ASVS 4.0.3 V2.1 / WSTG-IDNT-04, account enumeration).
    expect(taken.status).toBe(fresh.status);
    expect(taken.body).toEqual({ message: `An invitation is on its way to ${other.users.grower.email}.` });
    expect(fresh.body).toEqual({ message: `An invitation is on its way to fresh-${home.id.slice(0, 8)}@test.example.` });
    expect(JSON.stringify(taken.body)).not.toMatch(/already|account|in use|exists|another/i);
    const [letter] = await waitForMessage(other.users.grower.email);
    expect(letter.text).toContain(home.name);
    expect(letter.text).toMatch(/another e-mail address/);
    // No account was moved or made: the address still belongs to the other organisation.
    const [owner] = await sequelize.query<{ organisation_id: string }>('SELECT organisation_id FROM users WHERE email = :email', {
      replacements: { email: other.users.grower.email },
      type: QueryTypes.SELECT,
    });
    expect(owner.organisation_id).toBe(other.id);
    // An address among the admin's own users is refused plainly: the admin can see those anyway.
    const own = await admin.post('/api/users', { name: 'Again', email: home.users.scout.email, role: 'scout' });
    expect(own.status).toBe(409);
    expect(own.body.error.message).toMatch(/already one of your users/);
  });
});

describe('markup in user text reaches e-mail only escaped, and pages carry a script policy', () => {
  it('escapes the invited name, inviter and organisation in the invitation e-mail', async () => {
    const org = await makeOrganisation('Xss');
    await sequelize.query('UPDATE organisations SET name = :name WHERE id = :id', { replacements: { name: `Advisory ${MARKUP}`, id: org.id } });
    await sequelize.query('UPDATE users SET name = :name WHERE id = :id', { replacements: { name: `Admin ${MARKUP}`, id: org.users.admin.id } });
    const admin = await signedIn(org.users.admin.email);
    const email = `xss-${org.id.slice(0, 8)}@test.example`;
    await admin.post('/api/users', { name: MARKUP, email, role: 'scout' }).expect(202);
    const [message] = await waitForMessage(email);
    const html = String(message.html);
    expect(html).not.toContain('<img');
    expect(html.match(/&lt;img src=x onerror=alert\(1\)&gt;/g)?.length).toBe(3);
  });

  it('escapes farm, field, pest and recommendation text in the zone notice e-mail', async () => {
    const org = await makeOrganisation('Xss notice');
    const adviser = await signedIn(org.users.adviser.email);
    const scouted = await makeCheckedField(org, adviser, { fieldName: `Field ${MARKUP}` });
    await sequelize.query('UPDATE pests SET name = :name WHERE id = :id', { replacements: { name: `Aphid ${MARKUP}`, id: scouted.pest.id } });
    await sequelize.query('UPDATE farms SET name = :name WHERE id = :id', { replacements: { name: `Farm ${MARKUP}`, id: scouted.field.farmId } });
    await addContacts(scouted.field.farmId, [{ name: `Contact ${MARKUP}`, email: `contact-${org.id.slice(0, 8)}@farm.example` }]);
    const zoneSet = await acceptProposedZones(adviser, scouted);
    const notice = await adviser
      .post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: `Spray the zones ${MARKUP} <script>alert(2)</script>` })
      .expect(201);
    const preview = await adviser.get(`/api/notices/${notice.body.notice.id}/preview`).expect(200);
    expect(preview.body.html).not.toMatch(/<img src=x|<script>alert/);
    expect(preview.body.html).toContain('&lt;script&gt;alert(2)&lt;/script&gt;');
    expect(preview.body.html.match(/&lt;img src=x onerror=alert\(1\)&gt;/g)?.length).toBeGreaterThanOrEqual(4);
  });

  it("serves the app's pages with a Content-Security-Policy that allows no inline script", async () => {
    // The API suites run without a client build: the app's own index.html in a folder of its own stands in for it.
    const clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-client-'));
    fs.copyFileSync('index.html', path.join(clientDir, 'index.html'));
    const res = await request(createApp({ clientDir })).get('/fields');
    fs.rmSync(clientDir, { recursive: true, force: true });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    const policy = String(res.headers['content-security-policy']);
    const scriptSrc = /script-src ([^;]+)/.exec(policy)?.[1] ?? /default-src ([^;]+)/.exec(policy)?.[1];
    expect(scriptSrc).toBeTruthy();
    expect(scriptSrc).not.toMatch(/unsafe-inline|unsafe-eval|\*/);
    expect(policy).toMatch(/object-src 'none'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('path traversal', () => {
  it('keeps a photo sent as "../../etc/passwd.jpg" inside the upload folder under a name Patchwise made', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const outside = path.resolve(config.uploadDir, '..', 'etc');
    const res = await uploadPhotos(scout, [{ bytes: await makeJpeg(), name: '../../etc/passwd.jpg' }], { pestId: pest.id, fieldId: field.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('needs-pin');
    expect(res.body.results[0].fileName).toBe('passwd.jpg');
    expect(fs.existsSync(path.join(outside, 'passwd.jpg'))).toBe(false);
    const keyShape = /^[0-9a-f-]{36}\/\d{4}\/[0-9a-f-]{36}(-thumb)?\.(jpg|png|webp|heic|heif)$/;
    expect(uploadedFiles().filter((f) => !keyShape.test(f.split(path.sep).join('/')) && !f.endsWith('.gitkeep'))).toEqual([]);
  });

  it.each([
    '/api/photos/..%2f..%2fetc%2fpasswd/original',
    '/api/photos/..%2F..%2F..%2Fetc%2Fpasswd/thumbnail',
    '/api/photos/%2e%2e%2f%2e%2e%2fetc%2fpasswd/original',
    '/api/photos/../../etc/passwd',
  ])('refuses %s without reading any file', async (url) => {
    const admin = await signedIn((await makeOrganisation('Traversal')).users.admin.email);
    const res = await admin.get(url);
    expect([400, 404]).toContain(res.status);
    expect(res.text).not.toMatch(/root:.*:0:0:/);
    expect(res.headers['content-type']).toMatch(/json/);
  });
});

describe('injection through filters', () => {
  const attempts = [
    ['/api/sightings?fieldId=%27%20OR%201%3D1--', /field id is not valid/],
    ['/api/sightings?walkId=1%3BDROP%20TABLE%20users', /walk id is not valid/],
    ['/api/sightings?fieldId={field}&pestId=1%3BDROP%20TABLE%20users', /pest/i],
    ['/api/sightings?fieldId={field}&from=2026-01-01%27%20OR%20%271%27%3D%271', /date/i],
    ['/api/fields?farmId=%27%3B%20DELETE%20FROM%20fields%3B--', /farm id is not valid/],
    ['/api/walks?fieldId=%27%20UNION%20SELECT%20password_hash%20FROM%20users--', /field id is not valid/],
    ['/api/notices?fieldId=1%20OR%201%3D1', /field id is not valid/],
    ['/api/pests?includeInactive=true%27%20OR%20%27a%27%3D%27a', /includeInactive to true or false/],
    ['/api/fields/{field}/checks?pestId=%27%20OR%20%27%27%3D%27', /pest/i],
  ] as const;

  it.each(attempts)('%s is refused with 400 and changes nothing', async (template, message) => {
    const org = await makeOrganisation('Injection');
    const admin = await signedIn(org.users.admin.email);
    const { body } = await admin.get('/api/fields').expect(200);
    const fieldId = body.fields[0]?.id ?? crypto.randomUUID();
    const before = await tableCounts();
    const res = await admin.get(template.replace('{field}', fieldId));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid');
    expect(res.body.error.message).toMatch(message);
    expect(await tableCounts()).toEqual(before);
  });
});

describe('oversized bodies', () => {
  it('refuses a JSON body over the limit with 413 and a sentence, storing nothing', async () => {
    const org = await makeOrganisation('Oversized');
    const admin = await signedIn(org.users.admin.email);
    const before = await tableCounts();
    const res = await admin.post('/api/farms', { name: 'Huge farm', contacts: [], padding: 'x'.repeat(7 * 1024 * 1024) });
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'too_large', message: expect.stringMatching(/larger than the 6 MB limit; send less/) });
    expect(await tableCounts()).toEqual(before);
  });
});
