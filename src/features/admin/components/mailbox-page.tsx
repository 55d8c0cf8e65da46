// The local mail catcher's inbox: every invitation, reset and notice Patchwise sent.
import { Link, useParams } from 'react-router';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useMailMessages } from '../api/get-mail-messages.ts';
import { MailMessageView } from './mail-message-view.tsx';
import { useDates } from '../../../lib/dates.ts';

export function MailboxPage() {
  const dates = useDates();
  const { messageId } = useParams();
  const openId = messageId ? Number(messageId) : null;
  const messages = useMailMessages();
  return (
    <PageFrame
      title="Mailbox"
      eyebrow="Messages caught by the local mail server"
      wide
      actions={
        <Button variant="secondary" onClick={() => messages.refetch()} busy={messages.isFetching}>
          Check for new mail
        </Button>
      }
    >
      <div className="grid gap-5 lg:grid-cols-[22rem_1fr]">
        <Panel className={openId ? 'hidden self-start lg:block' : 'self-start'}>
          {messages.isPending ? (
            <LoadingState label="Loading messages…" />
          ) : messages.isError ? (
            <ErrorState error={messages.error} onRetry={() => messages.refetch()} />
          ) : messages.data.length === 0 ? (
            <EmptyState title="No messages yet">Invitations, password resets and zone notices appear here when no real mail server is set up.</EmptyState>
          ) : (
            <ul className="-my-2 divide-y divide-straw-200" aria-label="Messages">
              {messages.data.map((m) => (
                <li key={m.id}>
                  <Link
                    to={`/admin/mailbox/${m.id}`}
                    aria-current={m.id === openId ? 'true' : undefined}
                    className={`block rounded px-2 py-2 hover:bg-field-50 ${m.id === openId ? 'bg-field-50 ring-1 ring-field-200' : ''}`}
                  >
                    <span className="block truncate font-medium text-soil-900">{m.subject || '(no subject)'}</span>
                    <span className="block truncate text-xs text-soil-600">
                      To {m.to.join(', ')} · {dates.dateTime(m.receivedAt)}
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Panel>
        <Panel className={openId ? '' : 'hidden lg:block'}>
          {openId ? (
            <>
              <Link to="/admin/mailbox" className="mb-3 inline-block text-sm font-medium text-field-700 hover:underline lg:hidden">
                ← All messages
              </Link>
              <MailMessageView id={openId} />
            </>
          ) : (
            <p className="py-10 text-center text-soil-600">Choose a message to read it.</p>
          )}
        </Panel>
      </div>
    </PageFrame>
  );
}
