// The grower's questions and comments on a notice, with the adviser's answers, and the form to write one. The caller
// supplies the request (the e-mailed link's, or the signed-in grower's). Separate from the one-tap acknowledgement.
import { useState, type FormEvent } from 'react';
import type { NoticeQuestionView } from '@shared/schemas/notice-questions.ts';
import type { Dates } from '@shared/dates/format-dates.ts';
import { Button } from '../button.tsx';
import { TextAreaField } from '../form-field.tsx';

export interface QuestionControl {
  /** Sends the text; `sent` runs once the server has kept it, so the form can clear. */
  onAsk: (text: string, sent: () => void) => void;
  busy: boolean;
  /** The server's sentence when the question was refused. */
  error?: string;
}

export function NoticeQuestions({
  questions,
  adviserName,
  control,
  dates,
}: {
  questions: NoticeQuestionView[];
  adviserName: string;
  control: QuestionControl;
  dates: Dates;
}) {
  const [text, setText] = useState('');
  const submit = (event: FormEvent) => {
    event.preventDefault();
    control.onAsk(text, () => setText(''));
  };
  return (
    <section aria-labelledby="notice-questions" className="rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:hidden">
      <h2 id="notice-questions" className="mb-3 text-lg font-semibold text-field-900">
        Questions for {adviserName}
      </h2>
      {questions.length > 0 && (
        <ol aria-label="Your questions" className="mb-4 space-y-3">
          {questions.map((q) => (
            <li key={q.id} className="rounded-md bg-straw-50 p-3 ring-1 ring-inset ring-straw-300">
              <p className="whitespace-pre-wrap text-soil-900">{q.text}</p>
              <p className="mt-1 text-xs text-soil-600">
                {q.askerName}, {dates.dateTime(q.askedAt)}
              </p>
              {q.answer ? (
                <div className="mt-2 border-l-4 border-field-600 pl-3">
                  <p className="whitespace-pre-wrap text-soil-900">{q.answer.text}</p>
                  <p className="mt-1 text-xs text-soil-600">
                    Answer from {q.answer.adviserName}, {dates.dateTime(q.answer.answeredAt)}
                  </p>
                </div>
              ) : (
                <p className="mt-2 text-sm text-soil-700">Waiting for an answer; it will also come by e-mail.</p>
              )}
            </li>
          ))}
        </ol>
      )}
      <form onSubmit={submit} className="space-y-3">
        <TextAreaField
          label="Ask a question or leave a comment"
          hint="Up to 2,000 characters. Your adviser gets it by e-mail and answers here and by e-mail."
          maxLength={2000}
          value={text}
          onChange={(e) => setText(e.target.value)}
          error={control.error}
        />
        <Button type="submit" busy={control.busy} disabled={text.trim().length === 0}>
          Send to {adviserName}
        </Button>
      </form>
    </section>
  );
}
