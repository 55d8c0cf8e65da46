// The field's zone notices with their state, each opening its page.
import { Link } from 'react-router';
import { noticePath } from '@shared/attention-links.ts';
import type { NoticeView } from '@shared/schemas/notices.ts';
import { Panel } from '../../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../../components/query-states.tsx';
import { useNotices } from '../../../../lib/api/get-notices.ts';

const stateWords: Record<NoticeView['status'], string> = { draft: 'draft', sending: 'sending', sent: 'sent', 'partly-failed': 'some copies failed' };

function acknowledgement(notice: NoticeView): string {
  if (notice.recipients.length === 0) return '';
  const acknowledged = notice.recipients.filter((r) => r.acknowledgedAt).length;
  return ` · ${acknowledged} of ${notice.recipients.length} acknowledged`;
}

export function FieldNoticesList({ fieldId }: { fieldId: string }) {
  const notices = useNotices(fieldId);
  if (notices.isPending)
    return (
      <Panel title="Zone notices">
        <LoadingState label="Loading notices…" />
      </Panel>
    );
  if (notices.isError)
    return (
      <Panel title="Zone notices">
        <ErrorState error={notices.error} onRetry={() => notices.refetch()} />
      </Panel>
    );
  return (
    <Panel title="Zone notices">
      {notices.data.length === 0 ? (
        <p className="text-sm text-soil-600">No notices written for this field.</p>
      ) : (
        <ul className="divide-y divide-straw-200 text-sm" aria-label="Zone notices of this field">
          {notices.data.map((n) => (
            <li key={n.id} className="flex flex-wrap justify-between gap-2 py-2" data-notice={n.id} data-notice-state={n.status}>
              <Link to={noticePath(n.id)} className="font-medium text-field-700 underline-offset-2 hover:underline">
                {n.pestName}, zones version {n.zoneSetVersion} · {(n.sentAt ?? n.createdAt).slice(0, 10)}
              </Link>
              <span className="text-soil-700">
                {stateWords[n.status]}
                {acknowledgement(n)}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
