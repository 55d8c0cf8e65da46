// Names typed or pasted into forms (people, farms, contacts, fields, pests) are one line of printable text:
// control characters (Unicode general category Cc: C0, DEL and C1, and the line and paragraph separators U+2028/U+2029) are taken out before
// anything is stored, so a name cannot break an e-mail header, a CSV line or a log entry (OWASP ASVS 4.0.3 V5.1.4).
import { afterAll, describe, expect, it } from 'vitest';
import { stopQueue } from '../../server/jobs/queue.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';

afterAll(async () => {
  await stopQueue();
});

// U+000A line feed, U+000D carriage return, U+0009 tab, U+0007 bell, U+001B escape, U+007F delete, U+0085 next line.
const tainted = (word: string) => `\r\n${word}\u0007 Bend\nRoad\u001b[31m\u007f\u0085\t`;

describe('names lose their control characters', () => {
  it('stores farm, contact, field and pest names as one line of printable text', async () => {
    const org = await makeOrganisation('Names');
    const admin = await signedIn(org.users.admin.email);
    const farm = await createFarm(admin, { name: tainted('Willow'), contacts: [{ name: tainted('Ada'), email: `ada-${org.id.slice(0, 8)}@grower.example` }] });
    expect(farm.name).toBe('Willow Bend Road [31m');
    expect(farm.contacts[0].name).toBe('Ada Bend Road [31m');
    const field = await createField(admin, farm.id, undefined, { name: tainted('North') });
    expect(field.name).toBe('North Bend Road [31m');
    const pest = await createPest(admin, { name: tainted('Aphid') });
    expect(pest.name).toBe('Aphid Bend Road [31m');
  });

  it('stores invited and renamed user names as one line, U+2028 included', async () => {
    const org = await makeOrganisation('Names');
    const admin = await signedIn(org.users.admin.email);
    const email = `line-${org.id.slice(0, 8)}@test.example`;
    await admin.post('/api/users', { name: 'Ivy\r\nBcc: someone@elsewhere.example', email, role: 'scout' }).expect(202);
    const users = (await admin.get('/api/users').expect(200)).body.users as Array<{ id: string; email: string; name: string }>;
    expect(users.find((u) => u.email === email)?.name).toBe('Ivy Bcc: someone@elsewhere.example');
    const renamed = await admin.patch(`/api/users/${org.users.scout.id}`, { name: 'Rowan\u0000\n\u2028Hedge' }).expect(200);
    expect(renamed.body.user.name).toBe('Rowan Hedge');
  });

  it('refuses a name made only of control characters, saying what to enter', async () => {
    const org = await makeOrganisation('Names');
    const admin = await signedIn(org.users.admin.email);
    const res = await admin.post('/api/farms', { name: '\n\r\t', contacts: [] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toBe('Enter the farm name.');
  });
});
