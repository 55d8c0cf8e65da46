// The growers' questions on a sent notice, for the adviser: who asked (and from which address), and an answer
// form for each one not yet answered; the answer goes to the grower by e-mail and shows on their notice page.
import { useState, type FormEvent } from 'react';
import type { AdviserNoticeQuestionView } from '@shared/schemas/notice-questions.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { TextAreaField } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useNoticeQuestions } from '../api/get-notice-questions.ts';
import { useAnswerNoticeQuestion } from '../api/answer-notice-question.ts';
import { useDates } from '../../../lib/dates.ts';

function AnswerForm({ noticeId, question }: { noticeId: string; question: AdviserNoticeQuestionView }) {
  const [text, setText] = useState('');
  const answer = useAnswerNoticeQuestion(noticeId);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    answer.mutate({ questionId: question.id, text });
  };
  return (
    <form onSubmit={submit} className="mt-2 space-y-2">
      <TextAreaField
        label={`Answer ${question.askerName}`}
        maxLength={2000}
        value={text}
        onChange={(e) => setText(e.target.value)}
        error={answer.isError ? errorMessage(answer.error) : undefined}
      />
      <Button type="submit" busy={answer.isPending} disabled={text.trim().length === 0}>
        Send the answer
      </Button>
    </form>
  );
}

export function NoticeQuestionsPanel({ noticeId }: { noticeId: string }) {
  const dates = useDates();
  const questions = useNoticeQuestions(noticeId);
  return (
    <Panel title="Grower questions">
      {questions.isPending ? (
        <LoadingState label="Loading the questions…" />
      ) : questions.isError ? (
        <ErrorState error={questions.error} onRetry={() => questions.refetch()} />
      ) : questions.data.length === 0 ? (
        <p className="text-sm text-soil-700">No grower has asked about this notice yet.</p>
      ) : (
        <ol aria-label="Grower questions" className="space-y-4">
          {questions.data.map((q) => (
            <li key={q.id} className="rounded-md bg-straw-50 p-3 ring-1 ring-inset ring-straw-300">
              <p className="text-xs text-soil-600">
                {q.askerName} &lt;{q.askerEmail}&gt;, {dates.dateTime(q.askedAt)}
              </p>
              <p className="mt-1 whitespace-pre-wrap text-soil-900">{q.text}</p>
              {q.answer ? (
                <div className="mt-2 border-l-4 border-field-600 pl-3">
                  <p className="whitespace-pre-wrap text-soil-900">{q.answer.text}</p>
                  <p className="mt-1 text-xs text-soil-600">
                    Answered by {q.answer.adviserName}, {dates.dateTime(q.answer.answeredAt)}
                  </p>
                </div>
              ) : (
                <AnswerForm noticeId={noticeId} question={q} />
              )}
            </li>
          ))}
        </ol>
      )}
      {questions.isSuccess && questions.data.some((q) => !q.answer) && (
        <p className="mt-3 text-xs text-soil-600">Each answer is e-mailed to the grower and shown on their notice page.</p>
      )}
    </Panel>
  );
}
