// A grower's question or comment on a sent notice: from the e-mailed link or the grower's own page, stored, listed
// for the adviser and on the attention list, e-mailed to the adviser through the real local mail catcher with the
// grower as Reply-To; the adviser's answer shown on the notice page and e-mailed back with the adviser as Reply-To.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { ParsedMail } from 'mailparser';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { issueNoticeToken } from '../../server/services/notice-links.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { messagesTo, waitForMessage } from '../helpers/mailbox.ts';
import { acceptProposedZones, linkGrower, makeCheckedField } from '../helpers/zones.ts';

let org: TestOrganisation;
let adviser: Client;
let grower: Client;
let outsider: Client;
let visitor: Client;
let noticeId: string;
let token: string;
let contactEmail: string;

/** A copy as the notice worker leaves it once the SMTP server has accepted it. */
async function addSentCopy(notice: string, name: string, email: string) {
  const id = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO notice_recipients (id, notice_id, contact_name, email, status, attempts, message_id, smtp_accepted_at)
     VALUES (:id, :notice, :name, :email, 'sent', 1, :messageId, now())`,
    { replacements: { id, notice, name, email, messageId: `<question-test-${id}@test.example>` } },
  );
  return id;
}

beforeAll(async () => {
  org = await makeOrganisation('Notice questions');
  const other = await makeOrganisation('Notice questions other');
  adviser = await signedIn(org.users.adviser.email);
  grower = await signedIn(org.users.grower.email);
  outsider = await signedIn(other.users.adviser.email);
  visitor = await anonymous();
  const scouted = await makeCheckedField(org, adviser, { seed: 41 });
  await linkGrower(scouted.field.farmId, org.users.grower.id);
  const zoneSet = await acceptProposedZones(adviser, scouted);
  noticeId = (
    await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray both zones this week.' }).expect(201)
  ).body.notice.id;
  contactEmail = `cleo-${org.id.slice(0, 8)}@farm.example`;
  const copy = await addSentCopy(noticeId, 'Cleo Tillage', contactEmail);
  await sequelize.query(`UPDATE notices SET status = 'sent', sent_at = now() WHERE id = :noticeId`, { replacements: { noticeId } });
  token = await issueNoticeToken(copy);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

const questionCount = async () =>
  (
    await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM notice_questions WHERE notice_id = :noticeId', {
      replacements: { noticeId },
      type: QueryTypes.SELECT,
    })
  )[0].n;

const withSubject = (messages: ParsedMail[], pattern: RegExp) => messages.filter((m) => pattern.test(m.subject ?? ''));

describe('a question from the e-mailed link', () => {
  let questionId: string;

  it('is stored with control characters stripped, shown on the link page and e-mailed to the adviser with the grower as Reply-To', async () => {
    const res = await visitor
      .post(`/api/notice-links/${token}/questions`, { text: '  Is the\u0007 wet corner\u0000 in zone 1?\r\nIt floods in May.  ' })
      .expect(201);
    expect(res.body.question.text).toBe('Is the wet corner in zone 1?\nIt floods in May.');
    expect(res.body.question.askerName).toBe('Cleo Tillage');
    expect(res.body.adviserMailed).toBe(true);
    questionId = res.body.question.id;

    const page = await visitor.get(`/api/notice-links/${token}`).expect(200);
    expect(page.body.notice.questions).toEqual([res.body.question]);

    const [mail] = withSubject(await waitForMessage(org.users.adviser.email), /^Question from Cleo Tillage/);
    expect(mail.replyTo?.value).toEqual([{ address: contactEmail, name: 'Cleo Tillage' }]);
    expect(mail.text).toContain('> Is the wet corner in zone 1?\n> It floods in May.');
    expect(mail.text).toContain(`/notices/${noticeId}`);
  });

  it('is listed for the adviser with the address it came from, and counted among grower questions on the attention list', async () => {
    const list = await adviser.get(`/api/notices/${noticeId}/questions`).expect(200);
    expect(list.body.questions).toEqual([expect.objectContaining({ id: questionId, askerEmail: contactEmail, answer: null })]);
    const attention = await adviser.get('/api/advisers/attention').expect(200);
    const waiting = attention.body.growerQuestions.filter((q: { noticeId: string }) => q.noticeId === noticeId);
    expect(waiting).toHaveLength(1);
    expect(waiting[0].link).toBe(`/notices/${noticeId}`);
    expect(waiting[0].message).toMatch(/^Cleo Tillage asked about the .+ and is waiting for an answer\.$/);
    expect((await outsider.get('/api/advisers/attention').expect(200)).body.growerQuestions.map((q: { questionId: string }) => q.questionId)).not.toContain(
      questionId,
    );
  });

  it('is answered by the adviser once: shown on the notice page and e-mailed to the grower with the adviser as Reply-To', async () => {
    const answered = await adviser
      .post(`/api/notices/${noticeId}/questions/${questionId}/answer`, { text: 'Yes, the wet corner is the east half of zone 1.' })
      .expect(200);
    expect(answered.body.growerMailed).toBe(true);
    expect(answered.body.question.answer).toMatchObject({ text: 'Yes, the wet corner is the east half of zone 1.', adviserName: org.users.adviser.name });

    const [mail] = withSubject(await waitForMessage(contactEmail), /^Answer from /);
    expect(mail.replyTo?.value).toEqual([{ address: org.users.adviser.email, name: org.users.adviser.name }]);
    expect(mail.text).toContain('Yes, the wet corner is the east half of zone 1.');

    const page = await visitor.get(`/api/notice-links/${token}`).expect(200);
    expect(page.body.notice.questions[0].answer.text).toBe('Yes, the wet corner is the east half of zone 1.');
    const attention = await adviser.get('/api/advisers/attention').expect(200);
    expect(attention.body.growerQuestions.map((q: { questionId: string }) => q.questionId)).not.toContain(questionId);

    const again = await adviser.post(`/api/notices/${noticeId}/questions/${questionId}/answer`, { text: 'A second answer.' }).expect(409);
    expect(again.body.error.message).toMatch(/already been answered/);
    expect(withSubject(await messagesTo(contactEmail), /^Answer from /)).toHaveLength(1);
  });

  it.each([
    ['an empty question', '   '],
    ['only control characters', '\u0000\u0007\u001b'],
    ['2,001 characters', 'a'.repeat(2001)],
  ])('refuses %s, saying what to fix, and stores nothing', async (_label, text) => {
    const before = await questionCount();
    const res = await visitor.post(`/api/notice-links/${token}/questions`, { text }).expect(400);
    expect(res.body.error.message).toMatch(/question/);
    expect(await questionCount()).toBe(before);
  });

  it('takes a question of exactly 2,000 characters', async () => {
    await visitor.post(`/api/notice-links/${token}/questions`, { text: 'b'.repeat(2000) }).expect(201);
  });

  it('refuses a tampered link', async () => {
    const before = await questionCount();
    await visitor.post(`/api/notice-links/${token.slice(0, -1)}${token.endsWith('A') ? 'B' : 'A'}/questions`, { text: 'Hello?' }).expect(404);
    expect(await questionCount()).toBe(before);
  });
});

describe('a question from the grower’s own page', () => {
  it('reaches the adviser with the grower as Reply-To and shows on the grower’s page only', async () => {
    const res = await grower.post(`/api/grower/notices/${noticeId}/questions`, { text: 'Can the spraying wait until after the rain?' }).expect(201);
    expect(res.body.question.askerName).toBe(org.users.grower.name);
    const [mail] = withSubject(await waitForMessage(org.users.adviser.email, 2), new RegExp(`^Question from ${org.users.grower.name}`));
    expect(mail.replyTo?.value).toEqual([{ address: org.users.grower.email, name: org.users.grower.name }]);
    const mine = await grower.get(`/api/grower/notices/${noticeId}`).expect(200);
    expect(mine.body.notice.questions.map((q: { id: string }) => q.id)).toEqual([res.body.question.id]);
    const viaLink = await visitor.get(`/api/notice-links/${token}`).expect(200);
    expect(viaLink.body.notice.questions.map((q: { id: string }) => q.id)).not.toContain(res.body.question.id);
  });
});

describe('who may read and answer questions', () => {
  it('answers 404 to another organisation’s adviser and to an unknown question', async () => {
    const [{ id }] = (await adviser.get(`/api/notices/${noticeId}/questions`).expect(200)).body.questions;
    expect((await outsider.get(`/api/notices/${noticeId}/questions`)).status).toBe(404);
    expect((await outsider.post(`/api/notices/${noticeId}/questions/${id}/answer`, { text: 'Not my notice.' })).status).toBe(404);
    expect((await adviser.post(`/api/notices/${noticeId}/questions/${crypto.randomUUID()}/answer`, { text: 'No such question.' })).status).toBe(404);
  });

  it('refuses the grower the adviser’s routes', async () => {
    expect((await grower.get(`/api/notices/${noticeId}/questions`)).status).toBe(403);
  });
});
