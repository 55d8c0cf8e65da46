// The notices already written for a field, each linking to its status page.
import { Link } from 'react-router';
import { Panel } from '../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useNotices } from '../../../lib/api/get-notices.ts';
import { useDates } from '../../../lib/dates.ts';

const statusWords = { draft: 'draft', sending: 'sending', sent: 'sent', 'partly-failed': 'some copies failed' } as const;

export function FieldNoticesPanel({ fieldId }: { fieldId: string }) {
  const dates = useDates();
  const notices = useNotices(fieldId);
  if (notices.isPending)
    return (
      <Panel title="Notices for this field">
        <LoadingState label="Loading notices…" />
      </Panel>
    );
  if (notices.isError)
    return (
      <Panel title="Notices for this field">
        <ErrorState error={notices.error} onRetry={() => notices.refetch()} />
      </Panel>
    );
  if (notices.data.length === 0) return null;
  return (
    <Panel title="Notices for this field">
      <ul className="divide-y divide-straw-200 text-sm" aria-label="Notices for this field">
        {notices.data.map((n) => {
          const acknowledged = n.recipients.filter((r) => r.acknowledgedAt).length;
          return (
            <li key={n.id} className="flex flex-wrap justify-between gap-2 py-2">
              <Link to={`/notices/${n.id}`} className="font-medium text-field-700 hover:underline">
                {n.pestName}, zones version {n.zoneSetVersion} · {dates.date(n.sentAt ?? n.createdAt)}
              </Link>
              <span className="text-soil-700">
                {statusWords[n.status]}
                {n.recipients.length > 0 && ` · ${acknowledged} of ${n.recipients.length} acknowledged`}
              </span>
            </li>
          );
        })}
      </ul>
    </Panel>
  );
}
