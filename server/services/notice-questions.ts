// Questions and comments from growers on a sent notice, and the adviser's answers: stored first (nothing is lost
// when the mail server is down), then e-mailed; each reader sees the questions asked from their own copy or account.
import * as questions from '../queries/notice-questions.ts';
import { findNoticeMailNames } from '../queries/notices.ts';
import type { Actor } from '../auth/passport.ts';
import { conflict, notFound } from '../errors.ts';
import { logger } from '../logger.ts';
import { findNotice } from './notice-reading.ts';
import { mailAnswerToGrower, mailQuestionToAdviser, type QuestionMailFacts } from './notice-question-mail.ts';
import type { AdviserNoticeQuestionView, NoticeQuestionView, WaitingGrowerQuestion } from '../../shared/schemas/notice-questions.ts';

function questionView(r: questions.QuestionRow): NoticeQuestionView {
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
  const rows = await questions.listQuestionsOfReader(noticeId, { recipientId: asker.recipientId, userId: asker.userId, email: asker.email.toLowerCase() });
  return rows.map(questionView);
}

async function mailFacts(noticeId: string, question: { askerName: string; askerEmail: string; body: string }) {
  const row = await findNoticeMailNames(noticeId);
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
  const row = await questions.insertQuestion({
    noticeId,
    recipientId: asker.recipientId,
    userId: asker.userId,
    name: asker.name,
    email: asker.email.toLowerCase(),
    text,
  });
  const { facts, adviser } = await mailFacts(noticeId, { askerName: row.asker_name, askerEmail: row.asker_email, body: row.body });
  let adviserMailed = false;
  try {
    await mailQuestionToAdviser(facts, adviser);
    await questions.markAdviserMailed(row.id);
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
  const rows = await questions.listQuestionsOfNotice(notice.id);
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
  const updated = await questions.answerQuestionOnce(notice.id, questionId, text, actor.id);
  const row = await questions.findQuestionOfNotice(notice.id, questionId);
  if (!row) throw notFound('That question');
  if (!updated) throw conflict('This question has already been answered; the grower has that answer.');
  const { facts, organisationName } = await mailFacts(notice.id, { askerName: row.asker_name, askerEmail: row.asker_email, body: row.body });
  let growerMailed = false;
  try {
    await mailAnswerToGrower(facts, { text, adviserName: actor.name, adviserEmail: actor.email, organisationName });
    await questions.markGrowerMailed(row.id);
    growerMailed = true;
  } catch (error) {
    logger.warn({ err: error, questionId: row.id }, 'answer e-mail to the grower not sent');
  }
  return { question: { ...questionView(row), askerEmail: row.asker_email }, growerMailed };
}

/** Unanswered grower questions in the adviser's organisation, oldest first, for the attention list. */
export async function listWaitingGrowerQuestions(actor: Actor): Promise<WaitingGrowerQuestion[]> {
  if (actor.role !== 'admin' && actor.role !== 'adviser') return [];
  const rows = await questions.listUnansweredQuestionsOfOrganisation(actor.organisationId);
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
