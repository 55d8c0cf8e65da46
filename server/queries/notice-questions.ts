import { execute, selectRow, selectRows } from './sql.ts';

export interface QuestionRow {
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

/** The questions one reader asked on a notice: from their copy, their account or their address, oldest first. */
export const listQuestionsOfReader = (noticeId: string, reader: { recipientId: string | null; userId: string | null; email: string }) =>
  selectRows<QuestionRow>(
    `${SELECT_QUESTIONS} WHERE q.notice_id = :noticeId AND (q.recipient_id = :recipientId OR q.asked_by = :userId OR q.asker_email = :email) ORDER BY q.created_at, q.id`,
    { noticeId, recipientId: reader.recipientId, userId: reader.userId, email: reader.email },
  );

export const listQuestionsOfNotice = (noticeId: string) =>
  selectRows<QuestionRow>(`${SELECT_QUESTIONS} WHERE q.notice_id = :noticeId ORDER BY q.created_at, q.id`, { noticeId });

export const findQuestionOfNotice = (noticeId: string, questionId: string) =>
  selectRow<QuestionRow>(`${SELECT_QUESTIONS} WHERE q.id = :questionId AND q.notice_id = :noticeId`, { questionId, noticeId });

export const insertQuestion = async (question: {
  noticeId: string;
  recipientId: string | null;
  userId: string | null;
  name: string;
  email: string;
  text: string;
}) =>
  (await selectRow<QuestionRow>(
    `INSERT INTO notice_questions (notice_id, recipient_id, asked_by, asker_name, asker_email, body)
     VALUES (:noticeId, :recipientId, :userId, :name, :email, :text)
     RETURNING id, notice_id, asker_name, asker_email, body, created_at, answer, answered_at, NULL AS adviser_name`,
    { ...question },
  ))!;

/** Records the answer unless the question has one; whether it did. */
export const answerQuestionOnce = async (noticeId: string, questionId: string, text: string, actorId: string) =>
  !!(await selectRow<{ id: string }>(
    `UPDATE notice_questions SET answer = :text, answered_by = :actorId, answered_at = now(), updated_at = now()
      WHERE id = :questionId AND notice_id = :noticeId AND answered_at IS NULL RETURNING id`,
    { text, actorId, questionId, noticeId },
  ));

export const markAdviserMailed = (id: string) => execute('UPDATE notice_questions SET adviser_mailed_at = now(), updated_at = now() WHERE id = :id', { id });

export const markGrowerMailed = (id: string) => execute('UPDATE notice_questions SET grower_mailed_at = now(), updated_at = now() WHERE id = :id', { id });

export interface WaitingQuestionRow {
  id: string;
  notice_id: string;
  field_name: string;
  farm_name: string;
  pest_name: string;
  asker_name: string;
  created_at: Date;
}

/** Unanswered questions on the organisation's notices, oldest first. */
export const listUnansweredQuestionsOfOrganisation = (organisationId: string) =>
  selectRows<WaitingQuestionRow>(
    `SELECT q.id, q.notice_id, f.name AS field_name, fa.name AS farm_name, p.name AS pest_name, q.asker_name, q.created_at
       FROM notice_questions q JOIN notices n ON n.id = q.notice_id JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
      WHERE n.organisation_id = :org AND q.answered_at IS NULL ORDER BY q.created_at`,
    { org: organisationId },
  );
