// A grower's question or comment on a zone notice and the adviser's answer: the text both forms and the API accept.
import { z } from 'zod';

// Control characters (Unicode Cc) other than the line break and the tab are stripped: the text goes into e-mails
// and pages, and a pasted NUL or escape sequence has no place there. Line breaks stay (a question may have several lines).
const CONTROL = /[^\P{Cc}\n\t]/gu;
export const withoutControlCharactersKeepingLines = (text: string) => text.replace(/\r\n?/g, '\n').replace(CONTROL, '');

function messageText(emptyMessage: string, tooLongMessage: string) {
  return z
    .string({ error: emptyMessage })
    .overwrite(withoutControlCharactersKeepingLines)
    .trim()
    .min(1, { error: emptyMessage })
    .max(2000, { error: tooLongMessage });
}

export const noticeQuestionSchema = z
  .object({ text: messageText('Write your question or comment for the adviser.', 'Keep the question to 2,000 characters or fewer.') })
  .strict();
export type NoticeQuestionRequest = z.output<typeof noticeQuestionSchema>;

export const noticeAnswerSchema = z.object({ text: messageText('Write the answer for the grower.', 'Keep the answer to 2,000 characters or fewer.') }).strict();
export type NoticeAnswerRequest = z.output<typeof noticeAnswerSchema>;

export interface NoticeQuestionView {
  id: string;
  askerName: string;
  text: string;
  askedAt: string;
  answer: { text: string; adviserName: string; answeredAt: string } | null;
}
export interface NoticeQuestionResponse {
  question: NoticeQuestionView;
}
/** The adviser's list also shows who asked by which address. */
export interface AdviserNoticeQuestionView extends NoticeQuestionView {
  askerEmail: string;
}
export interface NoticeQuestionsResponse {
  questions: AdviserNoticeQuestionView[];
}

/** One unanswered grower question, for the adviser's attention list. */
export interface WaitingGrowerQuestion {
  questionId: string;
  noticeId: string;
  fieldName: string;
  farmName: string;
  pestName: string;
  askerName: string;
  askedAt: string;
  message: string;
}
