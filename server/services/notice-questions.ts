// Questions and comments from growers on a sent notice, and the adviser's answers: stored first (nothing is lost
// when the mail server is down), then e-mailed; each reader sees the questions asked from their own copy or account.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { conflict, notFound } from '../errors.ts';
import { logger } from '../logger.ts';
import { findNotice } from './notice-reading.ts';
import { mailAnswerToGrower, mailQuestionToAdviser, type QuestionMailFacts } from './notice-question-mail.ts';
import type { AdviserNoticeQuestionView, NoticeQuestionView, WaitingGrowerQuestion } from '../../shared/schemas/notice-questions.ts';

interface QuestionRow {
  id: string;
  notice_id: string;
  asker_name: string;
  asker_email: string;
  body: string;
  created_at: Date;
  answer: string | null;
  answered_at: Date | null;
  adviser_name: string | null;
}

const SELECT_QUESTIONS = `SELECT q.id, q.notice_id, q.asker_name, q.asker_email, q.body, q.created_at, q.answer, q.answered_at, u.name AS adviser_name
  FROM notice_questions q LEFT JOIN users u ON u.id = q.answered_by`;

function questionView(r: QuestionRow): NoticeQuestionView {
  return {
    id: r.id,
    askerName: r.asker_name,
    text: r.body,
    askedAt: r.created_at.toISOString(),
    answer: r.answer && r.answered_at ? { text: r.answer, adviserName: r.adviser_name ?? 'Your adviser', answeredAt: r.answered_at.toISOString() } : null,
  };
}

/** Who is asking: a copy's contact (through the link) or a signed-in grower of the farm. */
export interface Asker {
  name: string;
  email: string;
  recipientId: string | null;
  userId: string | null;
}

/** The questions one reader asked on a notice: from their copy, their account or their address. */
export async function readerQuestions(noticeId: string, asker: Pick<Asker, 'email' | 'recipientId' | 'userId'>): Promise<NoticeQuestionView[]> {
  const rows = await sequelize.query<QuestionRow>(
    `${SELECT_QUESTIONS} WHERE q.notice_id = :noticeId AND (q.recipient_id = :recipientId OR q.asked_by = :userId OR q.asker_email = :email) ORDER BY q.created_at, q.id`,
    { replacements: { noticeId, recipientId: asker.recipientId, userId: asker.userId, email: asker.email.toLowerCase() }, type: QueryTypes.SELECT },
  );
  return rows.map(questionView);
}

async function mailFacts(noticeId: string, question: { askerName: string; askerEmail: string; body: string }) {
  const [row] = await sequelize.query<{
    organisation_id: string;
    field_name: string;
    farm_name: string;
    pest_name: string;
    organisation_name: string;
    adviser_name: string;
    adviser_email: string;
  }>(
    `SELECT n.organisation_id, COALESCE(n.material->'content'->>'fieldName', f.name) AS field_name, COALESCE(n.material->'content'->>'farmName', fa.name) AS farm_name,
            COALESCE(n.material->'content'->>'pestName', p.name) AS pest_name, o.name AS organisation_name, u.name AS adviser_name, u.email AS adviser_email
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN organisations o ON o.id = n.organisation_id JOIN users u ON u.id = n.created_by WHERE n.id = :noticeId`,
    { replacements: { noticeId }, type: QueryTypes.SELECT },
  );
  const facts: QuestionMailFacts = {
    organisationId: row.organisation_id,
    noticeId,
    fieldName: row.field_name,
    farmName: row.farm_name,
    pestName: row.pest_name,
    askerName: question.askerName,
    askerEmail: question.askerEmail,
    question: question.body,
  };
  return { facts, adviser: { name: row.adviser_name, email: row.adviser_email }, organisationName: row.organisation_name };
}

/** Stores a grower's question and e-mails it to the notice's adviser; `adviserMailed` says whether the mail went out. */
export async function askQuestion(noticeId: string, asker: Asker, text: string): Promise<{ question: NoticeQuestionView; adviserMailed: boolean }> {
  const [row] = await sequelize.query<QuestionRow>(
    `INSERT INTO notice_questions (notice_id, recipient_id, asked_by, asker_name, asker_email, body)
     VALUES (:noticeId, :recipientId, :userId, :name, :email, :text)
     RETURNING id, notice_id, asker_name, asker_email, body, created_at, answer, answered_at, NULL AS adviser_name`,
    {
      replacements: { noticeId, recipientId: asker.recipientId, userId: asker.userId, name: asker.name, email: asker.email.toLowerCase(), text },
      type: QueryTypes.SELECT,
    },
  );
  const { facts, adviser } = await mailFacts(noticeId, { askerName: row.asker_name, askerEmail: row.asker_email, body: row.body });
  let adviserMailed = false;
  try {
    await mailQuestionToAdviser(facts, adviser);
    await sequelize.query('UPDATE notice_questions SET adviser_mailed_at = now(), updated_at = now() WHERE id = :id', { replacements: { id: row.id } });
    adviserMailed = true;
  } catch (error) {
    // The question is kept and listed in the app; the adviser's attention list counts it either way.
    logger.warn({ err: error, questionId: row.id }, 'question e-mail to the adviser not sent');
  }
  return { question: questionView(row), adviserMailed };
}

/** Every question on a notice of the adviser's organisation, oldest first. */
export async function listNoticeQuestions(actor: Actor, noticeId: string): Promise<AdviserNoticeQuestionView[]> {
  const notice = await findNotice(actor, noticeId);
  const rows = await sequelize.query<QuestionRow>(`${SELECT_QUESTIONS} WHERE q.notice_id = :noticeId ORDER BY q.created_at, q.id`, {
    replacements: { noticeId: notice.id },
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => ({ ...questionView(r), askerEmail: r.asker_email }));
}

/** Records the adviser's answer (once) and e-mails it to the grower who asked; `growerMailed` says whether it went out. */
export async function answerQuestion(
  actor: Actor,
  noticeId: string,
  questionId: string,
  text: string,
): Promise<{ question: AdviserNoticeQuestionView; growerMailed: boolean }> {
  const notice = await findNotice(actor, noticeId);
  const [updated] = await sequelize.query<{ id: string }>(
    `UPDATE notice_questions SET answer = :text, answered_by = :actorId, answered_at = now(), updated_at = now()
      WHERE id = :questionId AND notice_id = :noticeId AND answered_at IS NULL RETURNING id`,
    { replacements: { text, actorId: actor.id, questionId, noticeId: notice.id }, type: QueryTypes.SELECT },
  );
  const [row] = await sequelize.query<QuestionRow>(`${SELECT_QUESTIONS} WHERE q.id = :questionId AND q.notice_id = :noticeId`, {
    replacements: { questionId, noticeId: notice.id },
    type: QueryTypes.SELECT,
  });
  if (!row) throw notFound('That question');
  if (!updated) throw conflict('This question has already been answered; the grower has that answer.');
  const { facts, organisationName } = await mailFacts(notice.id, { askerName: row.asker_name, askerEmail: row.asker_email, body: row.body });
  let growerMailed = false;
  try {
    await mailAnswerToGrower(facts, { text, adviserName: actor.name, adviserEmail: actor.email, organisationName });
    await sequelize.query('UPDATE notice_questions SET grower_mailed_at = now(), updated_at = now() WHERE id = :id', { replacements: { id: row.id } });
    growerMailed = true;
  } catch (error) {
    logger.warn({ err: error, questionId: row.id }, 'answer e-mail to the grower not sent');
  }
  return { question: { ...questionView(row), askerEmail: row.asker_email }, growerMailed };
}

/** Unanswered grower questions in the adviser's organisation, oldest first, for the attention list. */
export async function listWaitingGrowerQuestions(actor: Actor): Promise<WaitingGrowerQuestion[]> {
  if (actor.role !== 'admin' && actor.role !== 'adviser') return [];
  const rows = await sequelize.query<{
    id: string;
    notice_id: string;
    field_name: string;
    farm_name: string;
    pest_name: string;
    asker_name: string;
    created_at: Date;
  }>(
    `SELECT q.id, q.notice_id, f.name AS field_name, fa.name AS farm_name, p.name AS pest_name, q.asker_name, q.created_at
       FROM notice_questions q JOIN notices n ON n.id = q.notice_id JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
      WHERE n.organisation_id = :org AND q.answered_at IS NULL ORDER BY q.created_at`,
    { replacements: { org: actor.organisationId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    questionId: r.id,
    noticeId: r.notice_id,
    fieldName: r.field_name,
    farmName: r.farm_name,
    pestName: r.pest_name,
    askerName: r.asker_name,
    askedAt: r.created_at.toISOString(),
    message: `${r.asker_name} asked about the ${r.pest_name} notice for ${r.field_name} (${r.farm_name}) and is waiting for an answer.`,
  }));
}
