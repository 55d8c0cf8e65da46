// Zone notices end to end: draft and preview, one e-mail per grower contact through the real local mail
// catcher (parsed with mailparser), the map PNG, the GeoJSON attachment, the tokenised notice page and its
// acknowledgement, SMTP failure and retry without duplicates, and who may see what.
import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { simpleParser, type Attachment, type ParsedMail } from 'mailparser';
import { Jimp } from 'jimp';
import { area as turfArea, booleanPointInPolygon } from '@turf/turf';
import { QueryTypes } from 'sequelize';
import type { MultiPolygon, Position } from 'geojson';
import { sequelize } from '../../server/db.ts';
import { config } from '../../server/config.ts';
import { resetMailTransport } from '../../server/mail/transport.ts';
import { startWorkers } from '../../server/jobs/workers.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import '../../server/jobs/all-workers.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { setNoticeRetryPolicy } from '../../server/services/notice-sending.ts';
import { deliverNoticeCopy } from '../../server/services/notice-mail.ts';
import { NOTICE_CAUTIONS } from '../../shared/notices/cautions.ts';
import { signedIn, testApp, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, addContacts, linkGrower, makeCheckedField, storedZones, type ScoutedCheck } from '../helpers/zones.ts';

let org: TestOrganisation;
let other: TestOrganisation;
let adviser: Client;
let scout: Client;
let grower: Client;
let outsider: Client;
let scouted: ScoutedCheck;
let zoneSet: Awaited<ReturnType<typeof acceptProposedZones>>;
let contacts: Array<{ name: string; email: string }>;

// A field name with markup in it: the HTML part must show it as text.
const FIELD_NAME = `Creek <b>&</b> "bottom" ${Date.now()}`;

beforeAll(async () => {
  org = await makeOrganisation('Notices');
  other = await makeOrganisation('Notices other');
  adviser = await signedIn(org.users.adviser.email);
  scout = await signedIn(org.users.scout.email);
  grower = await signedIn(org.users.grower.email);
  outsider = await signedIn(other.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: FIELD_NAME });
  zoneSet = await acceptProposedZones(adviser, scouted);
  const tag = org.id.slice(0, 8);
  contacts = [
    { name: 'Ada Furrow', email: `ada-${tag}@farm.example` },
    { name: 'The grower', email: org.users.grower.email },
  ];
  await addContacts(scouted.field.farmId, contacts);
  await linkGrower(scouted.field.farmId, org.users.grower.id);
  setNoticeRetryPolicy({ retryDelay: 1 });
  await startWorkers();
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

/** Every message the catcher holds for an address, parsed with the cid links kept as sent. */
async function mailTo(address: string): Promise<ParsedMail[]> {
  const rows = await sequelize.query<{ raw: Buffer }>('SELECT raw FROM mailbox_messages WHERE :address = ANY(envelope_to) ORDER BY id', {
    replacements: { address },
    type: QueryTypes.SELECT,
  });
  return Promise.all(rows.map((r) => simpleParser(r.raw, { keepCidLinks: true })));
}

async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const started = Date.now();
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() - started > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function draftNotice(recommendation = 'Spot-spray the two zones within five days; leave the rest of the field untreated.') {
  const res = await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation, rescoutOn: '2026-07-14' });
  expect(res.status).toBe(201);
  return res.body.notice as { id: string; status: string };
}

const getNotice = async (id: string) => (await adviser.get(`/api/notices/${id}`).expect(200)).body.notice;

async function sendAndDeliver() {
  const notice = await draftNotice();
  const sent = await adviser.post(`/api/notices/${notice.id}/send`);
  expect(sent.status).toBe(202);
  // The notice's own status follows its copies' a moment later, so wait for both.
  const view = await waitFor('both copies accepted and the notice sent', async () => {
    const v = await getNotice(notice.id);
    return v.status === 'sent' && v.recipients.length === 2 && v.recipients.every((r: { delivery: string }) => r.delivery === 'sent') ? v : null;
  });
  const messages = await Promise.all(
    view.recipients.map(async (r: { email: string; id: string }) => {
      const [row] = await sequelize.query<{ message_id: string }>('SELECT message_id FROM notice_recipients WHERE id = :id', {
        replacements: { id: r.id },
        type: QueryTypes.SELECT,
      });
      const mail = (await mailTo(r.email)).filter((m) => m.messageId === row.message_id);
      return { recipient: r, mail, messageId: row.message_id };
    }),
  );
  return { notice: view, messages };
}

const tokenIn = (mail: ParsedMail) => {
  const match = /\/n\/([0-9a-f-]{36}\.[A-Za-z0-9_-]{43})/.exec(mail.text ?? '');
  if (!match) throw new Error('no notice link in the message');
  return match[1];
};

const publicGet = (url: string) => request(testApp()).get(url);
const publicPost = (url: string) => request(testApp()).post(url);

describe('zone notice e-mail', () => {
  let delivered: Awaited<ReturnType<typeof sendAndDeliver>>;
  beforeAll(async () => {
    delivered = await sendAndDeliver();
  });

  it('delivers exactly one message per grower contact, with our fixed Message-ID', async () => {
    expect(delivered.messages).toHaveLength(2);
    for (const { mail, recipient } of delivered.messages) {
      expect(mail).toHaveLength(1);
      expect(mail[0].to).toMatchObject({ value: [{ address: recipient.email }] });
    }
    expect(new Set(delivered.messages.map((m) => m.messageId)).size).toBe(2);
  });

  it('names farm, field and pest in the subject and shows the field name as text in the HTML', () => {
    const mail = delivered.messages[0].mail[0];
    expect(mail.subject).toContain(FIELD_NAME);
    expect(mail.subject).toContain(scouted.pest.name);
    expect(mail.html).toContain('Creek &lt;b&gt;&amp;&lt;/b&gt; &quot;bottom&quot;');
    expect(mail.html).not.toContain('Creek <b>');
  });

  it('states the verdict and the check’s own figures in plain words, with the walk dates', () => {
    const { text, html } = delivered.messages[0].mail[0];
    const result = scouted.check.result as { n: number; spread: { verdict: string }; nearestNeighbour: { R: number; z: number } };
    expect(result.spread.verdict).toBe('clustered');
    // The check has a stops design: the notice leads with its primary test, Clark–Evans stays a value.
    expect(text).toMatch(/Clustered: the pest is more bunched than chance would bunch it among the stops made/);
    expect(text).toContain('K_found − K_all stops');
    expect(text).toContain(`Clark–Evans R = ${result.nearestNeighbour.R.toFixed(2)} (no edge correction`);
    expect(text).toContain(`${result.n} sightings inside the field`);
    expect(text).toMatch(/1 July 2026, 3 July 2026/);
    expect(html).toContain(`R = ${result.nearestNeighbour.R.toFixed(2)}`);
  });

  it('leads with the decision, then says in plain words each zone’s mean count against the threshold, figures last', async () => {
    const { text, html } = delivered.messages[0].mail[0];
    const zones = await storedZones(zoneSet.id);
    // The decision names every zone and the share left untreated, ahead of the statistics.
    const labels = zones.map((z) => z.label);
    const total = zones.reduce((sum, z) => sum + z.area_m2, 0);
    const decision = text!.indexOf('THE DECISION');
    expect(text!.slice(decision, decision + 400)).toContain(`${(total / 10_000).toFixed(2)} ha (${(total / 4046.8564224).toFixed(2)} ac) in all`);
    for (const label of labels) expect(text!.slice(decision, decision + 400)).toContain(label);
    const howWeKnow = text!.indexOf('HOW WE KNOW');
    expect(decision).toBeGreaterThan(-1);
    expect(howWeKnow).toBeGreaterThan(text!.indexOf('Spot-spray the two zones'));
    expect(text!.indexOf('Clark–Evans R =')).toBeGreaterThan(howWeKnow);
    expect(html!.indexOf('The decision')).toBeLessThan(html!.indexOf('How we know'));
    // Each zone's mean count, recomputed with turf's point-in-polygon over the stops the check used.
    for (const zone of zones) {
      const geometry = JSON.parse(zone.geometry) as MultiPolygon;
      const inside = scouted.points.filter((p) => p.count !== null && booleanPointInPolygon([p.lon, p.lat], geometry));
      const mean = inside.reduce((sum, p) => sum + (p.count as number), 0) / inside.length;
      // makeCheckedField's pest has an action threshold of 5.
      const side = mean >= 5 ? 'at or above' : 'below';
      const shown = new RegExp(`${zone.label}: a mean of ([\\d.]+) .* over ${inside.length} counted sightings?, ${side} the action threshold of 5\\.`);
      const match = shown.exec(text!);
      expect(match, `${zone.label} line in: ${text}`).not.toBeNull();
      expect(Number(match![1])).toBeCloseTo(mean, 1);
    }
  });

  it('holds the zone table with the stored areas, the recommendation and every caution in both parts', async () => {
    const { text, html } = delivered.messages[0].mail[0];
    for (const zone of await storedZones(zoneSet.id)) {
      const row = `${zone.label}: ${(zone.area_m2 / 10_000).toFixed(2)} ha (${(zone.area_m2 / 4046.8564224).toFixed(2)} ac), ${(zone.share_of_field * 100).toFixed(1)} % of the field, ${zone.sightings_inside} sighting`;
      expect(text).toContain(row);
      expect(html).toContain(`<td style="padding:4px 8px;border-bottom:1px solid #ebdcb4;text-align:right">${(zone.area_m2 / 10_000).toFixed(2)}</td>`);
    }
    expect(text).toContain('Spot-spray the two zones within five days');
    expect(text).toContain('Re-scout on: 14 July 2026');
    for (const caution of NOTICE_CAUTIONS) {
      expect(text).toContain(caution);
      expect(html).toContain(caution.replace(/'/g, '&#39;'));
    }
  });

  it('attaches the zones as RFC 7946 GeoJSON whose areas match the stored ones', async () => {
    const attachment = delivered.messages[0].mail[0].attachments.find((a: Attachment) => a.filename === 'zones.geojson');
    expect(attachment).toBeDefined();
    const collection = JSON.parse(attachment!.content.toString('utf8'));
    expect(collection.type).toBe('FeatureCollection');
    expect(collection.crs).toBeUndefined();
    const rows = await storedZones(zoneSet.id);
    expect(collection.features).toHaveLength(rows.length);
    collection.features.forEach((feature: { type: string; geometry: MultiPolygon; properties: { areaM2: number } }, i: number) => {
      // RFC 7946 §3.1.7: MultiPolygon coordinates are polygons of closed linear rings of [lon, lat] positions.
      expect(feature.type).toBe('Feature');
      expect(feature.geometry.type).toBe('MultiPolygon');
      for (const ring of feature.geometry.coordinates.flat()) {
        expect(ring.length).toBeGreaterThanOrEqual(4);
        expect(ring[0]).toEqual(ring[ring.length - 1]);
        expect(ring.every((p: Position) => p.length === 2 && Math.abs(p[0]) <= 180 && Math.abs(p[1]) <= 90)).toBe(true);
      }
      expect(feature.properties.areaM2).toBeCloseTo(rows[i].area_m2, 6);
      // turf (sphere) against PostGIS (ellipsoid): within 0.5 %.
      expect(Math.abs(turfArea(feature.geometry) - rows[i].area_m2) / rows[i].area_m2).toBeLessThan(0.005);
    });
  });

  it('carries an inline map PNG that decodes and shows the field, its zones and the boundary', async () => {
    const mail = delivered.messages[0].mail[0];
    const map = mail.attachments.find((a: Attachment) => a.contentType === 'image/png');
    expect(map?.cid).toBeTruthy();
    expect(mail.html).toContain(`src="cid:${map!.cid}"`);
    const image = await Jimp.read(map!.content);
    const { width, height, data } = image.bitmap;
    expect(width).toBeGreaterThan(200);
    const near = (i: number, [r, g, b]: number[], tolerance: number) =>
      Math.abs(data[i] - r) <= tolerance && Math.abs(data[i + 1] - g) <= tolerance && Math.abs(data[i + 2] - b) <= tolerance;
    let edge = 0;
    let zone = 0;
    for (let i = 0; i < data.length; i += 4) {
      if (near(i, [0x2f, 0x5d, 0x3a], 12)) edge++;
      // The zone colour #f08a4b at 60 % over the field colour #dcebd6.
      if (near(i, [232, 177, 131], 12)) zone++;
    }
    // The boundary of a ~420 m × 330 m field drawn about 740 px wide: a 3 px line some 2,600 px long; the legend adds under 300 px.
    expect(edge).toBeGreaterThan(2000);
    expect(zone).toBeGreaterThan(500);
    const centre = (Math.floor((height - 44) / 2) * width + Math.floor(width / 2)) * 4;
    expect(near(centre, [0xfb, 0xf8, 0xf0], 3)).toBe(false);
  });

  it('links to a notice page that opens without sign-in; the page, not the GET, records the opening', async () => {
    const { mail, recipient } = delivered.messages[0];
    const token = tokenIn(mail[0]);
    expect(mail[0].text).toContain(`${config.publicUrl}/n/${token}`);
    const page = await publicGet(`/api/notice-links/${token}`).expect(200);
    expect(page.body.notice.fieldName).toBe(FIELD_NAME);
    expect(page.body.notice.zones).toHaveLength(zoneSet.zones.length);
    expect(page.body.notice.zonesGeoJson.features).toHaveLength(zoneSet.zones.length);
    expect(page.body.notice.boundary.type).toBe('MultiPolygon');
    expect(page.body.notice.cautions).toEqual([...NOTICE_CAUTIONS]);
    expect(page.body.notice.walkDates).toEqual(['2026-07-01', '2026-07-03']);
    const png = await publicGet(page.body.notice.mapPath).expect(200);
    expect(png.headers['content-type']).toBe('image/png');
    expect((await Jimp.read(png.body)).bitmap.width).toBeGreaterThan(200);
    const stateOf = async () => (await getNotice(delivered.notice.id)).recipients.find((r: { id: string }) => r.id === recipient.id);
    expect(await stateOf()).toMatchObject({ state: 'sent', openedAt: null });
    const opened = await publicPost(`/api/notice-links/${token}/opened`).expect(200);
    expect(opened.body.alreadyOpened).toBe(false);
    const again = await publicPost(`/api/notice-links/${token}/opened`).expect(200);
    expect(again.body).toEqual({ openedAt: opened.body.openedAt, alreadyOpened: true });
    expect(await stateOf()).toMatchObject({ state: 'opened', openedAt: opened.body.openedAt });
  });

  it('takes an acknowledgement without a session or CSRF token, and a second one changes nothing', async () => {
    const { mail, recipient } = delivered.messages[1];
    const token = tokenIn(mail[0]);
    const first = await publicPost(`/api/notice-links/${token}/acknowledge`).expect(200);
    expect(first.body.alreadyAcknowledged).toBe(false);
    const second = await publicPost(`/api/notice-links/${token}/acknowledge`).expect(200);
    expect(second.body.alreadyAcknowledged).toBe(true);
    expect(second.body.acknowledgedAt).toBe(first.body.acknowledgedAt);
    const view = await getNotice(delivered.notice.id);
    const copy = view.recipients.find((r: { id: string }) => r.id === recipient.id);
    expect(copy.state).toBe('acknowledged');
    expect(copy.acknowledgedAt).toBe(first.body.acknowledgedAt);
  });

  it('never sends a copy again once the SMTP server accepted it', async () => {
    const { recipient, messageId } = delivered.messages[0];
    expect(await deliverNoticeCopy(recipient.id)).toBe('skipped');
    expect((await mailTo(recipient.email)).filter((m) => m.messageId === messageId)).toHaveLength(1);
  });

  it('refuses to send the same notice twice', async () => {
    const again = await adviser.post(`/api/notices/${delivered.notice.id}/send`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already gone to every grower contact/);
  });
});

describe('notice preview', () => {
  it('shows the subject, HTML and text as they will be sent, with a placeholder link', async () => {
    const notice = await draftNotice('Treat zone 1 only; <script>alert(1)</script> is not a product.');
    const res = await adviser.get(`/api/notices/${notice.id}/preview`).expect(200);
    expect(res.body.subject).toContain(FIELD_NAME);
    expect(res.body.text).toContain("(each grower's own link)");
    expect(res.body.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(res.body.html).not.toContain('<script>');
    for (const caution of NOTICE_CAUTIONS) expect(res.body.text).toContain(caution);
    const png = await adviser.get(res.body.mapPath).expect(200);
    expect(png.headers['content-type']).toBe('image/png');
  });

  it('refuses a notice without a recommendation, or for superseded zones', async () => {
    const empty = await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: '  ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/recommendation/);
    const scoutedAgain = await makeCheckedField(org, adviser, { seed: 3 });
    const older = await acceptProposedZones(adviser, scoutedAgain);
    await acceptProposedZones(adviser, scoutedAgain);
    const stale = await adviser.post('/api/notices', {
      fieldId: scoutedAgain.field.id,
      zoneSetId: older.id,
      recommendation: 'Treat the zones as drawn this week.',
    });
    expect(stale.status).toBe(400);
    expect(stale.body.error.message).toMatch(/replaced by a newer version/);
  });

  it('refuses to send when the farm has no grower contacts, saying what to add', async () => {
    const bare = await makeCheckedField(org, adviser, { seed: 4 });
    const bareZones = await acceptProposedZones(adviser, bare);
    const notice = (
      await adviser.post('/api/notices', { fieldId: bare.field.id, zoneSetId: bareZones.id, recommendation: 'Treat the zones as drawn this week.' }).expect(201)
    ).body.notice;
    const res = await adviser.post(`/api/notices/${notice.id}/send`);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/no grower contacts yet; add one/);
  });
});

describe('notice links', () => {
  let tokens: string[];
  let otherTokens: string[];
  let recipients: Array<{ id: string }>;
  let noticeId: string;
  beforeAll(async () => {
    const a = await sendAndDeliver();
    const b = await sendAndDeliver();
    tokens = a.messages.map((m) => tokenIn(m.mail[0]));
    otherTokens = b.messages.map((m) => tokenIn(m.mail[0]));
    recipients = a.notice.recipients;
    noticeId = a.notice.id;
  });

  const refused = async (token: string) => {
    const res = await publicGet(`/api/notice-links/${token}`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/^This notice link is not valid: .+\.$/);
    expect((await publicPost(`/api/notice-links/${token}/acknowledge`)).status).toBe(404);
    expect((await publicPost(`/api/notice-links/${token}/opened`)).status).toBe(404);
  };

  it('refuses a tampered token', async () => {
    const token = tokens[0];
    const flipped = token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A');
    await refused(flipped);
    await refused(token.slice(0, -1));
    await refused('not-a-token');
  });

  it('refuses a token whose secret belongs to another notice’s copy', async () => {
    const [id] = tokens[0].split('.');
    const [, otherSecret] = otherTokens[0].split('.');
    await refused(`${id}.${otherSecret}`);
    await publicGet(`/api/notice-links/${otherTokens[0]}`).expect(200);
  });

  it('refuses an expired token', async () => {
    await publicGet(`/api/notice-links/${tokens[1]}`).expect(200);
    await sequelize.query("UPDATE notice_recipients SET token_expires_at = now() - interval '1 second' WHERE id = :id", {
      replacements: { id: recipients[1].id },
    });
    await refused(tokens[1]);
  });

  it('refuses a revoked token and shows the withdrawal to the adviser', async () => {
    await publicGet(`/api/notice-links/${tokens[0]}`).expect(200);
    const res = await adviser.post(`/api/notices/${noticeId}/recipients/${recipients[0].id}/revoke`).expect(200);
    expect(res.body.notice.recipients.find((r: { id: string }) => r.id === recipients[0].id).revokedAt).toBeTruthy();
    await refused(tokens[0]);
  });
});

describe('SMTP outage', () => {
  it('marks copies failed with the reason, retries with back-off, and delivers exactly one message each once SMTP is back', async () => {
    const closedPort = await new Promise<number>((resolve) => {
      const probe = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = probe.address() as net.AddressInfo;
        probe.close(() => resolve(port));
      });
    });
    const workingUrl = config.smtpUrl;
    config.smtpUrl = `smtp://127.0.0.1:${closedPort}`;
    resetMailTransport();
    let noticeId: string;
    try {
      const notice = await draftNotice('Re-check the north zone before treating it.');
      noticeId = notice.id;
      await adviser.post(`/api/notices/${notice.id}/send`).expect(202);
      const failing = await waitFor('both copies failed once', async () => {
        const v = await getNotice(notice.id);
        return v.recipients.length === 2 && v.recipients.every((r: { delivery: string; attempts: number }) => r.delivery === 'failed' || r.attempts > 1)
          ? v
          : null;
      });
      for (const r of failing.recipients) {
        expect(r.smtpAcceptedAt).toBeNull();
        if (r.delivery === 'failed') expect(r.lastError).toMatch(/ECONNREFUSED|connect/i);
      }
      // Retries are still to come, so the notice is still going out.
      expect(failing.status).toBe('sending');
    } finally {
      config.smtpUrl = workingUrl;
      resetMailTransport();
    }
    const sent = await waitFor(
      'both copies accepted after the outage',
      async () => {
        const v = await getNotice(noticeId!);
        return v.status === 'sent' && v.recipients.every((r: { delivery: string }) => r.delivery === 'sent') ? v : null;
      },
      60_000,
    );
    expect(sent.status).toBe('sent');
    for (const r of sent.recipients) {
      expect(r.attempts).toBeGreaterThanOrEqual(2);
      expect(r.lastError).toBeNull();
      const [row] = await sequelize.query<{ message_id: string }>('SELECT message_id FROM notice_recipients WHERE id = :id', {
        replacements: { id: r.id },
        type: QueryTypes.SELECT,
      });
      expect((await mailTo(r.email)).filter((m) => m.messageId === row.message_id)).toHaveLength(1);
    }
  });
});

describe('notice access and follow-up', () => {
  it('lists a grower’s own notices with their own copy, and refuses them the adviser’s routes', async () => {
    const res = await grower.get('/api/grower/notices').expect(200);
    expect(res.body.notices.length).toBeGreaterThan(0);
    const mine = res.body.notices.filter((n: { myCopy: unknown }) => n.myCopy);
    expect(mine.length).toBeGreaterThan(0);
    expect(res.body.notices.every((n: { fieldName: string }) => n.fieldName === FIELD_NAME)).toBe(true);
    const anyNotice = res.body.notices[0].id;
    expect((await grower.get(`/api/notices/${anyNotice}`)).status).toBe(403);
    expect((await grower.post(`/api/notices/${anyNotice}/send`)).status).toBe(403);
    expect((await adviser.get('/api/grower/notices')).status).toBe(403);
  });

  it('refuses scouts every notice route', async () => {
    const notice = await draftNotice();
    expect(
      (await scout.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Treat the zones as drawn this week.' })).status,
    ).toBe(403);
    expect((await scout.get(`/api/notices/${notice.id}`)).status).toBe(403);
    expect((await scout.get(`/api/notices/${notice.id}/preview`)).status).toBe(403);
  });

  it('answers 404 to another organisation', async () => {
    const notice = await draftNotice();
    for (const url of [`/api/notices/${notice.id}`, `/api/notices/${notice.id}/preview`, `/api/notices/${notice.id}/map.png`])
      expect((await outsider.get(url)).status, url).toBe(404);
    expect((await outsider.post(`/api/notices/${notice.id}/send`)).status).toBe(404);
    expect(
      (await outsider.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Treat the zones as drawn this week.' })).status,
    ).toBe(404);
  });

  it('puts sent notices nobody acknowledged on the adviser’s attention list, and not acknowledged ones', async () => {
    const { notice: unread } = await sendAndDeliver();
    const { notice: read, messages } = await sendAndDeliver();
    await publicPost(`/api/notice-links/${tokenIn(messages[0].mail[0])}/acknowledge`).expect(200);
    const res = await adviser.get('/api/advisers/attention').expect(200);
    const ids = res.body.unacknowledgedNotices.map((n: { noticeId: string }) => n.noticeId);
    expect(ids).toContain(unread.id);
    expect(ids).not.toContain(read.id);
    expect(res.body.unacknowledgedNotices.find((n: { noticeId: string }) => n.noticeId === unread.id).link).toBe(`/notices/${unread.id}`);
    expect(res.body.unacknowledgedNotices.find((n: { noticeId: string }) => n.noticeId === unread.id).message).toMatch(/no grower has acknowledged it yet/);
    const theirs = await outsider.get('/api/advisers/attention').expect(200);
    expect(theirs.body.unacknowledgedNotices.map((n: { noticeId: string }) => n.noticeId)).not.toContain(unread.id);
  });
});

describe('a sent notice is a snapshot', () => {
  it('shows on its page, its map and a retried e-mail what was sent, after the field, its sightings and zones change', async () => {
    const later = await makeCheckedField(org, adviser, { seed: 7 });
    const laterZones = await acceptProposedZones(adviser, later);
    await addContacts(later.field.farmId, [{ name: 'Bea Headland', email: `bea-${org.id.slice(0, 8)}@farm.example` }]);
    const notice = (
      await adviser.post('/api/notices', { fieldId: later.field.id, zoneSetId: laterZones.id, recommendation: 'Spot-spray both zones this week.' }).expect(201)
    ).body.notice;
    await adviser.post(`/api/notices/${notice.id}/send`).expect(202);
    const view = await waitFor('the copy accepted', async () => {
      const v = await getNotice(notice.id);
      return v.status === 'sent' ? v : null;
    });
    const recipient = view.recipients[0];
    const [sentMail] = await mailTo(recipient.email);
    const token = tokenIn(sentMail);
    const pageAsSent = (await publicGet(`/api/notice-links/${token}`).expect(200)).body.notice;
    const mapAsSent = (await adviser.get(`/api/notices/${notice.id}/map.png`).buffer(true).expect(200)).body as Buffer;

    // The field grows, every sighting behind the check is deleted, one zone is reshaped and the other removed.
    await sequelize.query('UPDATE fields SET boundary = ST_Multi(ST_Expand(boundary, 0.002)) WHERE id = :id', { replacements: { id: later.field.id } });
    await sequelize.query('UPDATE sightings SET deleted_at = now() WHERE id = ANY(CAST(:ids AS uuid[]))', {
      replacements: { ids: `{${later.sightingIds.join(',')}}` },
    });
    const [first, ...rest] = laterZones.zones;
    await sequelize.query("UPDATE zones SET geometry = ST_Multi(ST_Buffer(geometry, 0.0003)), label = 'Reshaped' WHERE id = :id", {
      replacements: { id: first.id },
    });
    if (rest.length)
      await sequelize.query('DELETE FROM zones WHERE id = ANY(CAST(:ids AS uuid[]))', { replacements: { ids: `{${rest.map((z) => z.id).join(',')}}` } });
    const [field] = await sequelize.query<{ area_m2: number }>('SELECT area_m2 FROM fields WHERE id = :id', {
      replacements: { id: later.field.id },
      type: QueryTypes.SELECT,
    });
    expect(field.area_m2).toBeGreaterThan(pageAsSent.fieldAreaM2 * 1.5);

    const pageNow = (await publicGet(`/api/notice-links/${token}`).expect(200)).body.notice;
    expect(pageNow).toEqual(pageAsSent);
    expect(pageNow.walkDates).toEqual(['2026-07-01', '2026-07-03']);
    expect(pageNow.zones.map((z: { label: string }) => z.label)).toEqual(laterZones.zones.map((z) => z.label));
    const mapNow = (await adviser.get(`/api/notices/${notice.id}/map.png`).buffer(true).expect(200)).body as Buffer;
    expect(mapNow.equals(mapAsSent)).toBe(true);

    // A retry composes from the snapshot too: the field's area and zone table as they were sent.
    await sequelize.query("UPDATE notice_recipients SET status = 'failed', smtp_accepted_at = NULL, last_error = 'retried by the test' WHERE id = :id", {
      replacements: { id: recipient.id },
    });
    expect(await deliverNoticeCopy(recipient.id)).toBe('sent');
    const retried = (await mailTo(recipient.email)).at(-1)!;
    expect(retried.text).toContain(`(${(pageAsSent.fieldAreaM2 / 10_000).toFixed(2)} ha,`);
    for (const zone of laterZones.zones) expect(retried.text).toContain(`${zone.label}: ${(zone.areaM2 / 10_000).toFixed(2)} ha`);
    expect(retried.text).not.toContain('Reshaped');

    // A draft written now reads the field as it is.
    const draft = (
      await adviser.post('/api/notices', { fieldId: later.field.id, zoneSetId: laterZones.id, recommendation: 'Spot-spray the reshaped zone.' }).expect(201)
    ).body.notice;
    const preview = (await adviser.get(`/api/notices/${draft.id}/preview`).expect(200)).body;
    expect(preview.text).toContain(`(${(field.area_m2 / 10_000).toFixed(2)} ha,`);
    expect(preview.text).toContain('Reshaped: ');
  });
});
