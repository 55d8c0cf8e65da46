// The access matrix's tables: every API route × every kind of caller → the status the server must answer.
// tests/api/route-coverage.test.ts fails when a route the app serves has no row here.
import { adminOnly, anySignedIn, everyone, row, type AccessRow, type Expected } from './access-matrix.ts';
import { plainField } from './boundary-shapes.ts';
import { anonymous } from './http.ts';
import { makeJpeg, uploadPhotos } from './photos.ts';
import type { ScoutingWorld } from './access-scouting.ts';

const staff = { scout: 403, grower: 403 } as const;
const newPest = { name: '{newName}', kind: 'weed', countUnit: 'plants per m²', actionThreshold: 1, thresholdSource: 'Matrix test value' };

export const foundationRoutes: AccessRow[] = [
  row('GET', '/api/auth/me', everyone(200)),
  row('GET', '/api/config', everyone(200)),
  row('PUT', '/api/config/date-format', adminOnly(200, 200), { locale: 'en-GB', timeZone: 'Europe/London' }, 'each admin sets their own organisation'),

  row('GET', '/api/users', anySignedIn(200, staff)),
  row(
    'POST',
    '/api/users',
    adminOnly(202, 202),
    { name: 'Matrix Scout', email: '{newEmail}', role: 'scout' },
    'each admin invites into their own organisation',
  ),
  row('PATCH', '/api/users/{invitedUser}', adminOnly(200), { name: 'Invited Adviser Renamed' }),
  row('POST', '/api/users/{invitedUser}/invitation', adminOnly(200)),

  row('GET', '/api/farms', anySignedIn(200)),
  row('GET', '/api/farms/{linkedFarm}', anySignedIn(200, { otherAdmin: 404 }), undefined, 'the scout has a field on it, the grower is linked'),
  row('GET', '/api/farms/{unlinkedFarm}', anySignedIn(200, { grower: 404, otherAdmin: 404 }), undefined, 'the scout has a field on it'),
  row('GET', '/api/farms/{hiddenFarm}', anySignedIn(200, { scout: 404, grower: 404, otherAdmin: 404 })),
  row('POST', '/api/farms', adminOnly(201, 201), { name: '{newName}', contacts: [] }),
  row('PUT', '/api/farms/{hiddenFarm}', adminOnly(200), { name: 'Hidden farm renamed', contacts: [] }),
  row('DELETE', '/api/farms/{newFarm}', adminOnly(204)),
  row('POST', '/api/farms/{linkedFarm}/growers', adminOnly(204), { userId: '{grower}' }),
  row('DELETE', '/api/farms/{newFarm}/growers/{grower}', adminOnly(204)),

  row('GET', '/api/fields', anySignedIn(200)),
  row('GET', '/api/fields?farmId={linkedFarm}', anySignedIn(200)),
  row('GET', '/api/fields/{assignedField}', anySignedIn(200, { otherAdmin: 404 })),
  row('GET', '/api/fields/{growerOnlyField}', anySignedIn(200, { scout: 404, otherAdmin: 404 })),
  row('GET', '/api/fields/{scoutOnlyField}', anySignedIn(200, { grower: 404, otherAdmin: 404 })),
  row('GET', '/api/fields/{hiddenField}', anySignedIn(200, { scout: 404, grower: 404, otherAdmin: 404 })),
  row(
    'POST',
    '/api/fields',
    adminOnly(201, 400),
    { farmId: '{hiddenFarm}', name: '{newName}', crop: 'maize', season: 2026, boundary: plainField(6) },
    "another organisation's farm id in the body is refused as not one of your farms",
  ),
  row('PATCH', '/api/fields/{hiddenField}', adminOnly(200), { crop: 'winter wheat' }),
  row('DELETE', '/api/fields/{newField}', adminOnly(204)),
  row('POST', '/api/fields/{assignedField}/scouts', adminOnly(204), { userId: '{scout}' }),
  row('DELETE', '/api/fields/{newField}/scouts/{scout}', adminOnly(204)),

  row('GET', '/api/pests', anySignedIn(200)),
  row('GET', '/api/pests?includeInactive=true', anySignedIn(200)),
  row('POST', '/api/pests', adminOnly(201, 201), newPest),
  row('PATCH', '/api/pests/{pest}', adminOnly(200), { thresholdNote: 'Checked in the matrix' }),

  row('GET', '/api/mailbox', adminOnly(200, 200), undefined, "each admin reads their own organisation's mail"),
  row('GET', '/api/mailbox/{invitationMessage}', adminOnly(200)),
  row('GET', '/api/mailbox/{invitationMessage}/attachments/0', adminOnly(404), undefined, 'an invitation carries no attachment'),

  row('GET', '/api/fields/{foreignField}', anySignedIn(404, { otherAdmin: 200 })),
  row('GET', '/api/farms/{foreignFarm}', anySignedIn(404, { otherAdmin: 200 })),
  row('PATCH', '/api/pests/{foreignPest}', adminOnly(404, 200), { thresholdNote: 'Guessed id' }, "the home admin guesses the other organisation's pest id"),
  row('POST', '/api/fields/{assignedField}/scouts', adminOnly(404), { userId: '{foreignScout}' }, "another organisation's scout cannot be assigned"),
  row('POST', '/api/farms/{linkedFarm}/growers', adminOnly(404), { userId: '{foreignGrower}' }, "another organisation's grower cannot be linked"),
  row(
    'PATCH',
    '/api/users/{foreignScout}',
    adminOnly(404, 200),
    { name: 'Renamed across organisations' },
    "the home admin guesses the other organisation's user id",
  ),
];

/** Admins and advisers only (the desk roles); another organisation's admin finds no home record. */
const deskOnly = (ok: number, foreign = 404): Expected => ({ anonymous: 401, admin: ok, adviser: ok, scout: 403, grower: 403, otherAdmin: foreign });
/** Desk roles plus the grower of a linked farm (read-only views of zones). */
const deskAndGrower = (ok: number): Expected => ({ ...deskOnly(ok), grower: ok });
/** Everyone who records sightings: desk roles and the assigned scout; growers are refused. */
const recorders = (ok: number, foreign = 404): Expected => ({ anonymous: 401, admin: ok, adviser: ok, scout: ok, grower: 403, otherAdmin: foreign });
/** The signed-in grower's own views; every other role is refused by role. */
const growerOnly = (ok: number): Expected => ({ anonymous: 401, admin: 403, adviser: 403, scout: 403, grower: ok, otherAdmin: 403 });

const scouting = (w: unknown) => w as ScoutingWorld;
const aSentence = 'Spot-spray the patch by the creek within five days, then re-scout.';

export const scoutingRoutes: AccessRow[] = [
  row('GET', '/api/auth/csrf', everyone(200)),
  row(
    'POST',
    '/api/auth/sign-in',
    everyone(401),
    { email: 'nobody-in-the-matrix@test.example', password: 'not-the-password' },
    'an unknown address is refused alike for every caller',
  ),
  {
    ...row('POST', '/api/auth/sign-out', everyone(204), undefined, 'a fresh visitor signs out, so the callers keep their sessions'),
    send: async (_client, url) => (await anonymous()).post(url),
  },
  row('POST', '/api/auth/forgot-password', everyone(202), { email: '{newEmail}' }),
  row('POST', '/api/auth/set-password', everyone(400), { token: 'x'.repeat(43), password: 'a-long-enough-password' }, 'an unknown link token'),

  row('GET', '/api/walks', anySignedIn(200)),
  row('GET', '/api/walks?fieldId={assignedField}', anySignedIn(200)),
  row(
    'POST',
    '/api/walks',
    recorders(201),
    { fieldId: '{assignedField}', walkedOn: '2026-07-02' },
    "each caller starts their own walk; another organisation's field is not found",
  ),
  row(
    'POST',
    '/api/walks',
    { ...recorders(201), scout: 403 },
    { fieldId: '{hiddenField}', walkedOn: '2026-07-02' },
    'a scout may not walk a field they are not assigned to',
  ),
  row('GET', '/api/walks/{walk}', anySignedIn(200, { otherAdmin: 404 }), undefined, "the walk's field is on the grower's linked farm"),
  row('GET', '/api/walks/{walk}/summary', recorders(200), undefined, "the scout's own walk; a grower has no walk summaries"),
  row('PATCH', '/api/walks/{walk}', recorders(200), { notes: 'W pattern from the gate' }),
  row('POST', '/api/walks/{walk}/finish', recorders(200), {}, "the scout's own walk; finishing again keeps the first time, so every caller gets 200"),
  row('POST', '/api/walks/{walk}/stops', recorders(201), (w) => ({ pestId: '{pest}', ...scouting(w).insideAssigned, accuracyM: 5 })),

  row(
    'GET',
    '/api/sightings',
    { ...anySignedIn(200), admin: 400, adviser: 400, otherAdmin: 400 },
    undefined,
    'desk roles must name a field or walk; scouts and growers get their own scope',
  ),
  row('GET', '/api/sightings?fieldId={assignedField}', anySignedIn(200)),
  row('GET', '/api/sightings?fieldId={hiddenField}', anySignedIn(200), undefined, 'a field outside the scope lists nothing rather than failing'),
  row('GET', '/api/sightings/{sighting}', anySignedIn(200, { otherAdmin: 404 })),
  row('PATCH', '/api/sightings/{sighting}', recorders(200), { count: 4 }),
  row('DELETE', '/api/sightings/{newStop}', recorders(204), undefined, 'a fresh empty stop per caller'),
  row('POST', '/api/sightings/{newDeletedStop}/restore', recorders(200)),

  {
    ...row('POST', '/api/photos', { ...recorders(200), otherAdmin: 400 }, undefined, "another organisation's admin is told the pest is not in their library"),
    send: async (client, _url, world) =>
      uploadPhotos(client, [{ bytes: await makeJpeg(), name: 'matrix.jpg' }], { pestId: world.ids.pest, fieldId: world.ids.assignedField }),
  },
  row('GET', '/api/photos/{photo}/original', anySignedIn(200, { otherAdmin: 404 })),
  row('GET', '/api/photos/{photo}/thumbnail', anySignedIn(200, { otherAdmin: 404 })),

  row(
    'POST',
    '/api/checks',
    deskOnly(200),
    { fieldId: '{checkedField}', pestId: '{checkedPest}', options: { simulations: 99, seed: 5 } },
    'the stored check is reused',
  ),
  row('POST', '/api/checks/sensitivity', deskOnly(200), { fieldId: '{checkedField}', pestId: '{checkedPest}' }),
  row('GET', '/api/checks/{check}', deskOnly(200)),
  row('GET', '/api/checks/{check}/density', deskOnly(200)),
  row('GET', '/api/checks/{check}/stops', deskOnly(200)),
  row('GET', '/api/checks/{check}/quadrats', deskOnly(200)),
  row('GET', '/api/checks/{check}/scouted-area', deskOnly(200)),
  row('GET', '/api/checks/{check}/not-scouted-area', deskOnly(200)),
  row('GET', '/api/checks/{check}/sighting-ids', deskOnly(200)),
  row('GET', '/api/fields/{checkedField}/checks', deskOnly(200)),
  row('GET', '/api/fields/{checkedField}/threshold-status', deskOnly(200)),
  row('GET', '/api/fields/{checkedField}/history', deskOnly(200)),
  row('GET', '/api/advisers/attention', deskOnly(200, 200), undefined, "each admin sees their own organisation's list"),

  row('POST', '/api/checks/{check}/zone-proposal', deskOnly(200), { source: 'density' }),
  row('POST', '/api/fields/{spareField}/zone-sets', deskOnly(201), (w) => ({ checkId: '{spareCheck}', pestId: '{sparePest}', zones: scouting(w).spareZones })),
  row('GET', '/api/fields/{checkedField}/zone-sets', deskAndGrower(200)),
  row(
    'GET',
    '/api/fields/{spareField}/zone-sets',
    { ...deskOnly(200), grower: 404 },
    undefined,
    'the grower is not linked to that farm, so it is not found (scouts are refused by role)',
  ),
  row('GET', '/api/zone-sets/{zoneSet}', deskAndGrower(200)),
  row('GET', '/api/zone-sets/{zoneSet}/export.geojson', deskAndGrower(200)),
  row('GET', '/api/zone-sets/{zoneSet}/export.kml', deskAndGrower(200)),
  row('GET', '/api/zone-sets/{zoneSet}/export.taskdata.zip', deskAndGrower(200)),
  row('GET', '/api/zone-sets/{zoneSet}/export.shp.zip', deskAndGrower(200)),

  row('GET', '/api/notices', deskOnly(200, 200)),
  row('GET', '/api/notices?fieldId={checkedField}', deskOnly(200), undefined, "another organisation's field id is not found"),
  row('GET', '/api/notices/overview', deskOnly(200, 200), undefined, "each adviser lists their own organisation's notices"),
  row('GET', '/api/notices/overview?fieldId={checkedField}&state=not-acknowledged', deskOnly(200), undefined, "another organisation's field id is not found"),
  row('POST', '/api/notices', deskOnly(201), { fieldId: '{checkedField}', zoneSetId: '{zoneSet}', recommendation: aSentence }),
  row('GET', '/api/notices/{notice}', deskOnly(200)),
  row('GET', '/api/notices/{notice}/preview', deskOnly(200)),
  row('GET', '/api/notices/{notice}/map.png', deskOnly(200)),
  row('POST', '/api/notices/{newDraftNotice}/send', deskOnly(202), undefined, 'a fresh draft per caller'),
  row('POST', '/api/notices/{notice}/recipients/{spareRecipient}/revoke', deskOnly(200)),
  row('GET', '/api/notices/{notice}/questions', deskOnly(200)),
  row(
    'POST',
    '/api/notices/{notice}/questions/{newQuestion}/answer',
    deskOnly(200),
    { text: 'Yes: keep the usual buffer to the ditch, as the label says.' },
    'a fresh question per caller',
  ),

  row('GET', '/api/notice-links/{noticeToken}', everyone(200), undefined, 'the token in the e-mailed link is the credential'),
  row('GET', '/api/notice-links/{noticeToken}/map.png', everyone(200)),
  row('GET', '/api/notice-links/{noticeToken}/zones.taskdata.zip', everyone(200)),
  row('GET', '/api/notice-links/{noticeToken}/zones.shp.zip', everyone(200)),
  row('POST', '/api/notice-links/{noticeToken}/acknowledge', everyone(200)),
  row(
    'POST',
    '/api/notice-links/{noticeToken}/questions',
    everyone(201),
    { text: 'Is the headland included in zone 1?' },
    'the token is the credential; the visitor sends the CSRF token of their cookie',
  ),
  row('POST', '/api/notice-links/{noticeToken}/opened', everyone(200), undefined, 'the page reports its opening; the token is the credential'),
  row('GET', '/api/notice-links/{recipient}.not-the-secret', everyone(404)),

  row('GET', '/api/grower/notices', growerOnly(200)),
  row('GET', '/api/grower/notices/{notice}', growerOnly(200), undefined, "the notice's farm is linked to the grower"),
  row('GET', '/api/grower/notices/{notice}/map.png', growerOnly(200)),
  row('GET', '/api/grower/notices/{notice}/zones.taskdata.zip', growerOnly(200)),
  row('GET', '/api/grower/notices/{notice}/zones.shp.zip', growerOnly(200)),
  row(
    'POST',
    '/api/grower/notices/{notice}/questions',
    growerOnly(201),
    { text: 'Can the zones wait until after the rain?' },
    "the notice's farm is linked to the grower",
  ),
  row('POST', '/api/grower/notices/{notice}/opened', growerOnly(200), undefined, 'the grower holds no copy of it, so nothing is recorded'),
  row(
    'POST',
    '/api/grower/notices/{notice}/acknowledge',
    growerOnly(409),
    undefined,
    "the grower's address is not among the notice's copies, so there is no copy of theirs to acknowledge",
  ),
];
