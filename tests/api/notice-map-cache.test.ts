// The public notice page's map image is drawn once per notice version and then served from memory, so a mail
// program or a visitor fetching it again and again costs no second render. The real renderer runs; the spy
// only counts its calls (speed itself is measured in benchmarks, never asserted in tests).
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { issueNoticeToken } from '../../server/services/notice-links.ts';
import * as noticeMap from '../../server/services/notice-map.ts';
import { signedIn, testApp, type Client } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { acceptProposedZones, makeCheckedField } from '../helpers/zones.ts';

vi.mock('../../server/services/notice-map.ts', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../server/services/notice-map.ts')>();
  return { ...real, renderNoticeMap: vi.fn(real.renderNoticeMap) };
});

let adviser: Client;
let noticeId: string;
let token: string;

beforeAll(async () => {
  const org = await makeOrganisation('Map cache');
  adviser = await signedIn(org.users.adviser.email);
  const scouted = await makeCheckedField(org, adviser, { seed: 41 });
  const zones = await acceptProposedZones(adviser, scouted);
  noticeId = (
    await adviser
      .post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zones.id, recommendation: 'Spot-spray the zones this week; re-scout the rest next week.' })
      .expect(201)
  ).body.notice.id;
  const recipientId = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO notice_recipients (id, notice_id, contact_name, email, status, attempts, message_id, smtp_accepted_at)
     VALUES (:id, :noticeId, 'Ada Furrow', :email, 'sent', 1, :messageId, now())`,
    { replacements: { id: recipientId, noticeId, email: `ada-${recipientId.slice(0, 8)}@farm.example`, messageId: `<map-cache-${recipientId}@test.example>` } },
  );
  await sequelize.query(`UPDATE notices SET status = 'sent', sent_at = now(), updated_at = now() WHERE id = :noticeId`, { replacements: { noticeId } });
  token = await issueNoticeToken(recipientId);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

const fetchMap = () => request(testApp()).get(`/api/notice-links/${token}/map.png`).buffer(true).expect(200);

describe('the public notice map image', () => {
  it('is rendered once however often it is fetched, and the same image comes back', async () => {
    vi.mocked(noticeMap.renderNoticeMap).mockClear();
    const first = await fetchMap();
    const again = await Promise.all([fetchMap(), fetchMap(), fetchMap()]);
    expect(vi.mocked(noticeMap.renderNoticeMap)).toHaveBeenCalledTimes(1);
    for (const res of again) expect(Buffer.compare(res.body as Buffer, first.body as Buffer)).toBe(0);
  });

  it('is rendered again for a new version of the notice', async () => {
    await fetchMap();
    vi.mocked(noticeMap.renderNoticeMap).mockClear();
    await sequelize.query(`UPDATE notices SET updated_at = now() + interval '1 second' WHERE id = :noticeId`, { replacements: { noticeId } });
    await fetchMap();
    await fetchMap();
    expect(vi.mocked(noticeMap.renderNoticeMap)).toHaveBeenCalledTimes(1);
  });
});
