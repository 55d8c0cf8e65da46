import { useId } from 'react';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { attachmentUrl, useMailMessage } from '../api/get-mail-message.ts';
import { useDates } from '../../../lib/dates.ts';

const size = (bytes: number) =>
  bytes < 1024 ? `${bytes} B` : bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(1)} kB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`;

export function MailMessageView({ id }: { id: number }) {
  const dates = useDates();
  const message = useMailMessage(id);
  const plainTextId = useId();
  if (message.isPending) return <LoadingState label="Opening the message…" />;
  if (message.isError) return <ErrorState error={message.error} onRetry={() => message.refetch()} />;
  const m = message.data;
  return (
    <article className="space-y-4" aria-labelledby="mail-subject">
      <header className="space-y-1 border-b border-straw-200 pb-3">
        <h2 id="mail-subject" className="text-lg font-semibold text-soil-900">
          {m.subject || '(no subject)'}
        </h2>
        <dl className="grid grid-cols-[4rem_1fr] gap-x-2 text-sm">
          <dt className="text-soil-600">From</dt>
          <dd>{m.from ?? '—'}</dd>
          <dt className="text-soil-600">To</dt>
          <dd>{m.to.join(', ')}</dd>
          <dt className="text-soil-600">Received</dt>
          <dd>{dates.dateTime(m.receivedAt)}</dd>
        </dl>
      </header>
      {m.html && (
        <section>
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-soil-600">As the recipient sees it</h3>
          {/* An empty sandbox: no scripts, no forms, no same-origin access for mail content. */}
          <iframe title={`Message: ${m.subject ?? ''}`} sandbox="" srcDoc={m.html} className="h-96 w-full rounded-md bg-white ring-1 ring-soil-300/60" />
        </section>
      )}
      <section>
        <h3 id={plainTextId} className="mb-1 text-xs font-semibold uppercase tracking-wide text-soil-600">
          Plain text
        </h3>
        {/* Focusable so that a keyboard can scroll a long message. */}
        <pre
          role="region"
          aria-labelledby={plainTextId}
          tabIndex={0}
          className="max-h-80 overflow-auto whitespace-pre-wrap rounded-md bg-straw-50 p-3 font-sans text-sm text-soil-800 ring-1 ring-straw-200 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
        >
          {m.text || '(no text part)'}
        </pre>
      </section>
      {m.attachments.length > 0 && (
        <section>
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-soil-600">Attachments</h3>
          <ul className="space-y-1">
            {m.attachments.map((a) => (
              <li key={a.index}>
                <a href={attachmentUrl(m.id, a.index)} download={a.filename} className="font-medium text-field-700 underline-offset-2 hover:underline">
                  {a.filename}
                </a>{' '}
                <span className="text-xs text-soil-600">
                  {a.contentType}, {size(a.size)}
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </article>
  );
}
