// GET /api/config gives the signed-in organisation's date format, read with the session; an admin's change shows on
// the very next request, in that organisation only, and a bad value is refused with a sentence that says what to fix.
import { describe, expect, it } from 'vitest';
import { anonymous, signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { DEFAULT_DATE_FORMAT } from '../../shared/dates/format-dates.ts';

describe('the organisation date format in GET /api/config', () => {
  it('follows an admin change on the next request, for that organisation only', async () => {
    const home = await makeOrganisation('Dates home');
    const other = await makeOrganisation('Dates other');
    const admin = await signedIn(home.users.admin.email);
    const adviser = await signedIn(home.users.adviser.email);
    const outsider = await signedIn(other.users.adviser.email);

    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual(DEFAULT_DATE_FORMAT);
    // "en-us" is the same BCP 47 tag as "en-US"; Intl.getCanonicalLocales writes it in its canonical case (ECMA-402, CanonicalizeLocaleList).
    const put = await admin.put('/api/config/date-format', { locale: 'en-us', timeZone: 'America/Chicago' }).expect(200);
    expect(put.body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });

    // The adviser's session was read before the change: the next request reads the organisation again.
    expect((await adviser.get('/api/config').expect(200)).body.dateFormat).toEqual({ locale: 'en-US', timeZone: 'America/Chicago' });
    expect((await outsider.get('/api/config').expect(200)).body.dateFormat).toEqual(DEFAULT_DATE_FORMAT);
  });

  it('gives a visitor the default format, and refuses an adviser or a zone outside the IANA database', async () => {
    const org = await makeOrganisation('Dates refusals');
    const visitor = await anonymous();
    expect((await visitor.get('/api/config').expect(200)).body.dateFormat).toEqual(DEFAULT_DATE_FORMAT);

    const adviser = await signedIn(org.users.adviser.email);
    await adviser.put('/api/config/date-format', { locale: 'de-DE', timeZone: 'Europe/Berlin' }).expect(403);

    const admin = await signedIn(org.users.admin.email);
    const bad = await admin.put('/api/config/date-format', { locale: 'en-GB', timeZone: 'Europe/Atlantis' }).expect(400);
    expect(JSON.stringify(bad.body.error)).toMatch(/time zone/i);
    expect((await admin.get('/api/config').expect(200)).body.dateFormat).toEqual(DEFAULT_DATE_FORMAT);
  });
});
