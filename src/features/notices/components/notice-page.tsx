// The adviser's view of one notice: a draft previews and sends; a sent notice shows each copy's status,
// refreshing by itself while any copy is still on its way.
import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { isStillSending, useNotice } from '../api/get-notice.ts';
import { useSendNotice } from '../api/send-notice.ts';
import { NoticePreview } from './notice-preview.tsx';
import { RecipientsTable } from './recipients-table.tsx';
import { NoticeQuestionsPanel } from './notice-questions-panel.tsx';
import { SendNoticeDialog } from './send-notice-dialog.tsx';
import { useDates } from '../../../lib/dates.ts';

const statusWords = { draft: 'Draft, not sent', sending: 'Sending', sent: 'Sent to every contact', 'partly-failed': 'Some copies failed' } as const;

export function NoticePage() {
  const dates = useDates();
  const { noticeId = '' } = useParams();
  const notice = useNotice(noticeId);
  const send = useSendNotice();
  const [choosing, setChoosing] = useState(false);
  if (notice.isPending)
    return (
      <PageFrame title="Zone notice">
        <LoadingState label="Loading the notice…" />
      </PageFrame>
    );
  if (notice.isError)
    return (
      <PageFrame title="Zone notice">
        <ErrorState error={notice.error} onRetry={() => notice.refetch()} />
      </PageFrame>
    );
  const n = notice.data;
  const failed = n.recipients.filter((r) => r.delivery === 'failed' && !r.revokedAt);

  return (
    <PageFrame
      title={`Zone notice · ${n.fieldName}`}
      eyebrow={
        <>
          {n.farmName} ·{' '}
          <Link className="hover:underline" to={`/fields/${n.fieldId}/zones${n.checkId ? `?checkId=${n.checkId}` : ''}`}>
            {n.pestName}, zones version {n.zoneSetVersion}
          </Link>
        </>
      }
      wide
    >
      <Panel
        title="Status"
        actions={
          <span className="rounded-full bg-straw-100 px-3 py-1 text-sm font-medium text-soil-800" data-testid="notice-status">
            {statusWords[n.status]}
          </span>
        }
      >
        {n.status === 'draft' ? (
          <div className="space-y-3">
            <p className="text-sm text-soil-700">
              Check the preview below, then send one e-mail to each grower contact of {n.farmName}; you see who gets it before it goes. Each copy carries its
              own link to the notice page.
            </p>
            <Button
              onClick={() => {
                send.reset();
                setChoosing(true);
              }}
            >
              Send the notice
            </Button>
            <SendNoticeDialog
              notice={n}
              open={choosing}
              busy={send.isPending}
              error={send.error}
              onCancel={() => setChoosing(false)}
              onSend={(recipients) => send.mutate({ id: n.id, recipients }, { onSuccess: () => setChoosing(false) })}
            />
          </div>
        ) : (
          <div className="space-y-3">
            <p className="text-sm text-soil-700">
              Sent {n.sentAt ? dates.dateTime(n.sentAt) : ''} by {n.createdBy.name}.
              {isStillSending(n) && <span role="status"> Copies are still going out; this page updates by itself.</span>}
            </p>
            <RecipientsTable notice={n} />
            {failed.length > 0 && n.status === 'partly-failed' && (
              <Button variant="secondary" onClick={() => send.mutate({ id: n.id })} busy={send.isPending}>
                Send the {failed.length} failed cop{failed.length === 1 ? 'y' : 'ies'} again
              </Button>
            )}
          </div>
        )}
        {send.isError && !choosing && (
          <div className="mt-3">
            <FormMessage>{errorMessage(send.error)}</FormMessage>
          </div>
        )}
      </Panel>

      <Panel title="Recommendation">
        <p className="whitespace-pre-wrap text-soil-900">{n.recommendation}</p>
        {n.rescoutOn && <p className="mt-2 text-sm text-soil-700">Re-scout on {dates.calendarDate(n.rescoutOn)}.</p>}
      </Panel>

      {n.status !== 'draft' && <NoticeQuestionsPanel noticeId={n.id} />}

      {n.status === 'draft' ? (
        <Panel title="Preview">
          <NoticePreview noticeId={n.id} />
        </Panel>
      ) : (
        <details className="rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60">
          <summary className="cursor-pointer font-semibold text-field-900">The e-mail as sent</summary>
          <div className="mt-3">
            <NoticePreview noticeId={n.id} />
          </div>
        </details>
      )}
    </PageFrame>
  );
}
