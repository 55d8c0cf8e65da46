// The lines of the adviser's attention list that are about this field; nothing shows when there are none.
import { Link } from 'react-router';
import { Panel } from '../../../../components/page-frame.tsx';
import { ErrorState } from '../../../../components/query-states.tsx';
import { useAttention } from '../../../../lib/api/get-attention.ts';

export function FieldAttentionPanel({ fieldId, noticeIds }: { fieldId: string; noticeIds: string[] }) {
  const attention = useAttention();
  if (attention.isPending) return null;
  if (attention.isError)
    return (
      <Panel title="Needs attention here">
        <ErrorState error={attention.error} onRetry={() => attention.refetch()} />
      </Panel>
    );
  const a = attention.data;
  const lines = [
    ...a.aboveThreshold.filter((l) => l.fieldId === fieldId).map((l) => ({ key: `above-${l.pestId}-${l.reason}`, message: l.message, link: l.link })),
    ...a.tooFewStops.filter((l) => l.fieldId === fieldId).map((l) => ({ key: `too-few-${l.pestId}`, message: l.message, link: l.link })),
    ...a.notYetChecked.filter((l) => l.fieldId === fieldId).map((l) => ({ key: `unchecked-${l.pestId}`, message: l.message, link: l.link })),
    ...a.rescoutDue.filter((l) => l.fieldId === fieldId).map((l) => ({ key: `rescout-${l.pestId}`, message: l.message, link: l.link })),
    ...a.unacknowledgedNotices.filter((l) => l.fieldId === fieldId).map((l) => ({ key: `notice-${l.noticeId}`, message: l.message, link: l.link })),
    // Questions carry their notice, not the field: the field's own notices pick them out.
    ...a.growerQuestions.filter((q) => noticeIds.includes(q.noticeId)).map((q) => ({ key: `question-${q.questionId}`, message: q.message, link: q.link })),
  ];
  if (lines.length === 0) return null;
  return (
    <Panel title="Needs attention here" className="ring-patch-400">
      <ul className="space-y-2 text-sm" aria-label="Needs attention on this field">
        {lines.map((line) => (
          <li key={line.key} data-attention-line>
            <Link to={line.link} className="font-medium text-patch-700 underline-offset-2 hover:underline">
              {line.message}
            </Link>
          </li>
        ))}
      </ul>
    </Panel>
  );
}
