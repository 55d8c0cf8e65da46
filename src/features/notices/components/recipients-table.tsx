// Each grower contact's copy: delivery (queued, sent, failed with its reason), then opened and acknowledged.
import type { Dates } from '@shared/dates/format-dates.ts';
import { useState } from 'react';
import type { NoticeView, RecipientView } from '@shared/schemas/notices.ts';
import { Button } from '../../../components/button.tsx';
import { ConfirmDialog } from '../../../components/confirm-dialog.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useRevokeRecipient } from '../api/revoke-recipient.ts';
import { RecipientStateBadge } from './recipient-state.tsx';
import { useDates } from '../../../lib/dates.ts';

function Details({ r, dates }: { r: RecipientView; dates: Dates }) {
  const lines: string[] = [];
  if (r.delivery === 'failed') lines.push(`Not delivered${r.lastError ? `: ${r.lastError}` : ''} (${r.attempts} attempt${r.attempts === 1 ? '' : 's'})`);
  if (r.smtpAcceptedAt) lines.push(`Accepted by the mail server ${dates.dateTime(r.smtpAcceptedAt)}`);
  if (r.openedAt) lines.push(`Opened ${dates.dateTime(r.openedAt)}`);
  if (r.acknowledgedAt) lines.push(`Acknowledged ${dates.dateTime(r.acknowledgedAt)}`);
  if (r.revokedAt) lines.push(`Link withdrawn ${dates.dateTime(r.revokedAt)}`);
  else if (r.linkExpiresAt) lines.push(`Link valid until ${dates.date(r.linkExpiresAt)}`);
  return (
    <ul className="space-y-0.5 text-soil-700">
      {lines.map((line) => (
        <li key={line} className={line.startsWith('Not delivered') ? 'font-medium text-patch-700' : ''}>
          {line}
        </li>
      ))}
    </ul>
  );
}

export function RecipientsTable({ notice }: { notice: NoticeView }) {
  const dates = useDates();
  const revoke = useRevokeRecipient();
  const [confirming, setConfirming] = useState<RecipientView | null>(null);
  return (
    <>
      <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-soil-300/60">
        <table className="min-w-full text-left text-sm">
          <caption className="sr-only">Recipients of this notice</caption>
          <thead className="bg-straw-100 text-xs text-soil-700">
            <tr>
              <th scope="col" className="px-3 py-2">
                Recipient
              </th>
              <th scope="col" className="px-3 py-2">
                Status
              </th>
              <th scope="col" className="px-3 py-2">
                Details
              </th>
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-straw-200">
            {notice.recipients.map((r) => (
              <tr key={r.id} data-recipient={r.email}>
                <td className="px-3 py-2 align-top">
                  <p className="font-medium text-soil-900">{r.name}</p>
                  <p className="text-soil-600">{r.email}</p>
                  {r.addedForNotice && <p className="text-xs text-soil-600">Added for this notice only</p>}
                </td>
                <td className="px-3 py-2 align-top" data-testid="recipient-state">
                  <RecipientStateBadge state={r.state} />
                </td>
                <td className="px-3 py-2 align-top">
                  <Details r={r} dates={dates} />
                </td>
                <td className="px-3 py-2 text-right align-top">
                  {!r.revokedAt && (
                    <Button variant="quiet" size="sm" onClick={() => setConfirming(r)} aria-label={`Withdraw the link of ${r.name}`}>
                      Withdraw link
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {revoke.isError && <FormMessage>{errorMessage(revoke.error)}</FormMessage>}
      <ConfirmDialog
        open={confirming !== null}
        title="Withdraw this notice link?"
        confirmLabel="Withdraw link"
        busy={revoke.isPending}
        onCancel={() => setConfirming(null)}
        onConfirm={() => confirming && revoke.mutate({ noticeId: notice.id, recipientId: confirming.id }, { onSettled: () => setConfirming(null) })}
      >
        {confirming?.name}’s link to the notice page will stop working at once, and a copy not sent yet will not go out. The e-mail already delivered stays in
        their mailbox.
      </ConfirmDialog>
    </>
  );
}
