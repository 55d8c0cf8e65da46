// One date format for a notice's e-mail and its page, in the organisation's locale: an admin sets en-US and America/Chicago,
// and the e-mailed notice and the page the grower opens write the re-scout and walk dates alike.
// Expected strings: the Unicode CLDR long date pattern for en-US, "MMMM d, y" (applied by ECMA-402 Intl.DateTimeFormat).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { noticeLinkToken, waitForMessage } from '../helpers/mailbox.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let admin: Client;
let adviser: Client;
let scouted: ScoutedCheck;
const contact = { name: 'Dates contact', email: `dates-${Date.now()}@farm.example` };

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Notice dates')]);
  [admin, adviser] = await Promise.all([signedIn(org.users.admin.email), signedIn(org.users.adviser.email)]);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Date meadow' });
  await addContacts(scouted.field.farmId, [contact]);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('the organisation’s date format', () => {
  it('is the default (en-GB, Europe/London) for a visitor and the organisation’s own once an admin sets it', async () => {
    const visitor = await anonymous();
    expect((await visitor.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-GB', timeZone: 'Europe/London' });
    const set = await admin.put('/api/config/date-format', { locale: 'en-us', timeZone: 'America/Chicago' }).expect(200);
    expect(set.body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
  });

  it('refuses a zone that is not in the IANA database with a sentence, and keeps the stored format', async () => {
    const refused = await admin.put('/api/config/date-format', { locale: 'en-US', timeZone: 'America/Springfield' }).expect(400);
    expect(refused.body.error.message).toMatch(/IANA name such as Europe\/London/);
    expect((await admin.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
  });

  it('writes the same dates in the notice e-mail and on the page the grower opens from it', async () => {
    const zoneSet = await acceptProposedZones(adviser, scouted);
    const drafted = await adviser
      .post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray the zones this week.', rescoutOn: '2026-07-14' })
      .expect(201);
    await adviser.post(`/api/notices/${drafted.body.notice.id}/send`).expect(202);
    const [mail] = await waitForMessage(contact.email, 1, 30_000);
    // makeCheckedField walks the field on 2026-07-01 and 2026-07-03.
    expect(mail.text).toContain('Re-scout on: July 14, 2026');
    expect(mail.text).toContain('Walk dates: July 1, 2026, July 3, 2026.');

    const page = await browser.newPage();
    try {
      await page.goto(`${server.url}/n/${noticeLinkToken(mail)}`);
      await page.getByRole('heading', { name: /Date meadow/ }).waitFor();
      const shown = (await page.locator('main').textContent()) ?? '';
      expect(shown).toContain('Re-scout on July 14, 2026.');
      expect(shown).toContain('walked on July 1, 2026, July 3, 2026.');
    } finally {
      await page.close();
    }
  });
});
