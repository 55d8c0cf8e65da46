// The development mailbox: an admin reads the local mail catcher's messages to their own organisation, never a
// link meant for another person (reset, invitation, notice) and never another organisation's mail, and the
// mailbox exists only while the app's own catcher takes its mail (OWASP ASVS 4.0.3 V2.5.6/V3.5: recovery links
// reach only their owner; V14.3: no development stand-in exposed next to a real mail service).
import { afterAll, describe, expect, it } from 'vitest';
import { config, mailboxServed } from '../../server/config.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { anonymous, signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { linkToken, waitForMessage } from '../helpers/mailbox.ts';
import { createFarm } from '../helpers/farm-records.ts';

afterAll(async () => {
  await stopQueue();
});

type Listed = { id: number; to: string[]; subject: string | null };

async function everyMessageText(admin: Awaited<ReturnType<typeof signedIn>>) {
  const list = await admin.get('/api/mailbox').expect(200);
  const messages = list.body.messages as Listed[];
  const texts: string[] = [];
  for (const m of messages) {
    const one = await admin.get(`/api/mailbox/${m.id}`).expect(200);
    texts.push(`${one.body.message.text}\n${one.body.message.html ?? ''}`);
  }
  return { messages, texts: texts.join('\n') };
}

describe('development mailbox', () => {
  it("shows no other organisation's password-reset mail to an admin who made that address a farm contact", async () => {
    const home = await makeOrganisation('Mailbox home');
    const victim = await makeOrganisation('Mailbox victim');
    const admin = await signedIn(home.users.admin.email);
    await createFarm(admin, { contacts: [{ name: 'Borrowed contact', email: victim.users.admin.email }] });
    await (await anonymous()).post('/api/auth/forgot-password', { email: victim.users.admin.email }).expect(202);
    const [reset] = await waitForMessage(victim.users.admin.email);
    const token = linkToken(reset);

    const { messages, texts } = await everyMessageText(admin);
    expect(messages.filter((m) => m.to.includes(victim.users.admin.email))).toEqual([]);
    expect(texts).not.toContain(token);
  });

  it("hides a colleague's reset link from an admin of the same organisation, and the link still works for its owner", async () => {
    const org = await makeOrganisation('Mailbox colleague');
    const admin = await signedIn(org.users.admin.email);
    await (await anonymous()).post('/api/auth/forgot-password', { email: org.users.adviser.email }).expect(202);
    const [reset] = await waitForMessage(org.users.adviser.email);
    const token = linkToken(reset);

    const { messages, texts } = await everyMessageText(admin);
    expect(messages.some((m) => m.to.includes(org.users.adviser.email))).toBe(true);
    expect(texts).not.toContain(token);
    expect(texts).toMatch(/link hidden/);
    await (await anonymous()).post('/api/auth/set-password', { token, password: 'Meadow-lark-sings-at-dawn-2026' }).expect(200);
  });

  it('hides an invitation link from the admin who sent it (and from every other admin)', async () => {
    const org = await makeOrganisation('Mailbox invite');
    const admin = await signedIn(org.users.admin.email);
    const email = `invitee-${org.id.slice(0, 8)}@test.example`;
    await admin.post('/api/users', { name: 'New Adviser', email, role: 'adviser' }).expect(202);
    const token = linkToken((await waitForMessage(email))[0]);

    const { messages, texts } = await everyMessageText(admin);
    expect(messages.some((m) => m.to.includes(email))).toBe(true);
    expect(texts).not.toContain(token);
  });

  it("does not show one organisation the invitation-declined letter sent to another organisation's user", async () => {
    const home = await makeOrganisation('Mailbox declined');
    const other = await makeOrganisation('Mailbox declined other');
    const admin = await signedIn(home.users.admin.email);
    await createFarm(admin, { contacts: [{ name: 'Borrowed contact', email: other.users.scout.email }] });
    await admin.post('/api/users', { name: 'Someone', email: other.users.scout.email, role: 'scout' }).expect(202);
    await waitForMessage(other.users.scout.email);

    const { messages } = await everyMessageText(admin);
    expect(messages.filter((m) => m.to.includes(other.users.scout.email))).toEqual([]);
  });

  it('answers 404 when mail goes to a real SMTP server rather than the local catcher', async () => {
    const org = await makeOrganisation('Mailbox real smtp');
    const admin = await signedIn(org.users.admin.email);
    const served = config.mailboxServed;
    config.mailboxServed = false;
    try {
      const list = await admin.get('/api/mailbox');
      expect(list.status).toBe(404);
      expect((await admin.get('/api/mailbox/1')).status).toBe(404);
      expect((await admin.get('/api/config')).body.mailCatcher).toBe(false);
    } finally {
      config.mailboxServed = served;
    }
  });

  it('serves the mailbox only when SMTP_URL names the catcher the app runs on loopback', () => {
    const base = { NODE_ENV: 'test', MAIL_CATCHER_PORT: '2525' };
    expect(mailboxServed({ ...base, SMTP_URL: 'smtp://127.0.0.1:2525' })).toBe(true);
    expect(mailboxServed({ ...base, SMTP_URL: 'smtp://mail.example.com:2525' })).toBe(false);
    expect(mailboxServed({ ...base, SMTP_URL: 'smtp://127.0.0.1:587' })).toBe(false);
    expect(mailboxServed({ NODE_ENV: 'test', SMTP_URL: 'smtp://127.0.0.1:2525' })).toBe(false);
    expect(mailboxServed({ ...base, SMTP_URL: 'smtp://127.0.0.1:2525', NODE_ENV: 'production' })).toBe(false);
    expect(mailboxServed({ ...base, SMTP_URL: 'smtp://127.0.0.1:2525', MAIL_CATCHER: 'off' })).toBe(false);
  });
});
