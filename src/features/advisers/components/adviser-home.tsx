// The adviser's home: what needs attention now — fields, patches and zones above their threshold, fields due a walk,
// sightings not yet checked, notices the grower has not acknowledged, questions growers asked — each line opening its own page.
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { AttentionField, AttentionRescout } from '@shared/schemas/checks.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useAttention } from '../../../lib/api/get-attention.ts';
import { attentionAction } from '../attention-action.ts';
import { NeedsConfirmingMark } from '../../../components/needs-confirming-mark.tsx';
import { useDates } from '../../../lib/dates.ts';

const primaryLink =
  'shrink-0 rounded-md bg-field-700 px-3 py-1.5 text-sm font-medium text-white hover:bg-field-800 focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-field-600';
const quietLink = 'shrink-0 rounded-md px-3 py-1.5 text-sm font-medium text-field-800 ring-1 ring-inset ring-soil-300 hover:bg-straw-100';

function Section({ title, count, tone, children, empty }: { title: string; count: number; tone: string; children: ReactNode; empty: string }) {
  return (
    <Panel
      title={
        <span className="flex items-center gap-2">
          {title}
          <span className={`rounded-full px-2 py-0.5 text-xs font-semibold ${tone}`}>{count}</span>
        </span>
      }
    >
      {count === 0 ? <p className="text-sm text-soil-600">{empty}</p> : <ul className="divide-y divide-straw-200">{children}</ul>}
    </Panel>
  );
}

function RescoutRow({ item }: { item: AttentionRescout }) {
  return (
    <li className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 py-2.5" data-attention={item.reason}>
      <div className="min-w-0">
        <p className="font-medium text-soil-900">
          {item.fieldName} <span className="font-normal text-soil-600">· {item.farmName}</span> <span className="text-patch-700">· {item.pestName}</span>
        </p>
        <p className="text-sm text-soil-700">{item.message}</p>
        <p className="text-xs text-soil-500">
          Every {item.rescoutDays} days — {item.rescoutSource}
          {!item.rescoutConfirmed && <span className="font-medium text-soil-700"> · interval not yet confirmed in the pest library</span>}
        </p>
      </div>
      <Link to={item.link} className={quietLink}>
        {attentionAction(item)}
      </Link>
    </li>
  );
}

function FieldRow({ item, action }: { item: AttentionField; action: string }) {
  return (
    <li className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 py-2.5" data-attention={item.reason}>
      <div className="min-w-0">
        <p className="font-medium text-soil-900">
          {item.fieldName} <span className="font-normal text-soil-600">· {item.farmName}</span> <span className="text-patch-700">· {item.pestName}</span>
        </p>
        <p className="text-sm text-soil-700">{item.message}</p>
        <p className="text-xs text-soil-500">
          Threshold {item.thresholdWords} — {item.thresholdSource}
        </p>
        {!item.thresholdConfirmed && <NeedsConfirmingMark />}
      </div>
      <Link to={item.link} className={primaryLink}>
        {action}
      </Link>
    </li>
  );
}

export function AdviserHome() {
  const dates = useDates();
  const attention = useAttention();
  return (
    <PageFrame
      title="Needs your attention"
      eyebrow="Fields across your advisory business"
      actions={
        <Link to="/fields" className="text-sm font-medium text-field-700 underline-offset-2 hover:underline">
          All fields
        </Link>
      }
      wide
    >
      {attention.isPending ? (
        <LoadingState label="Looking for fields that need you…" />
      ) : attention.isError ? (
        <ErrorState error={attention.error} onRetry={() => attention.refetch()} />
      ) : attention.data.aboveThreshold.length +
          attention.data.tooFewStops.length +
          attention.data.notYetChecked.length +
          attention.data.rescoutDue.length +
          attention.data.unacknowledgedNotices.length +
          attention.data.growerQuestions.length ===
        0 ? (
        <EmptyState title="Nothing needs you right now">
          Every field’s sightings are checked, no field, patch or zone is above its threshold, no field is due a walk and every notice is acknowledged.
        </EmptyState>
      ) : (
        <div className="grid items-start gap-5 xl:grid-cols-2">
          {attention.data.growerQuestions.length > 0 && (
            <Section
              title="Questions from growers"
              count={attention.data.growerQuestions.length}
              tone="bg-patch-100 text-patch-800"
              empty="No grower is waiting for an answer."
            >
              {attention.data.growerQuestions.map((q) => (
                <li key={q.questionId} className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 py-2.5" data-attention="grower-question">
                  <div className="min-w-0">
                    <p className="font-medium text-soil-900">
                      {q.fieldName} <span className="font-normal text-soil-600">· {q.farmName}</span> <span className="text-patch-700">· {q.pestName}</span>
                    </p>
                    <p className="whitespace-pre-line text-sm text-soil-700">“{q.message}”</p>
                    <p className="text-xs text-soil-600">
                      {q.askerName}, {dates.dateTime(q.askedAt)}
                    </p>
                  </div>
                  <Link to={q.link} className={primaryLink}>
                    Answer
                  </Link>
                </li>
              ))}
            </Section>
          )}
          <Section
            title="Above the action threshold"
            count={attention.data.aboveThreshold.length}
            tone="bg-patch-600 text-white"
            empty="No field, patch or zone is above its pest’s action threshold."
          >
            {attention.data.aboveThreshold.map((item) => (
              <FieldRow key={`${item.fieldId}-${item.pestId}`} item={item} action={attentionAction(item)} />
            ))}
          </Section>
          {attention.data.tooFewStops.length > 0 && (
            <Section
              title="Too few stops to call — scout again"
              count={attention.data.tooFewStops.length}
              tone="bg-straw-300 text-soil-900"
              empty="Every field's latest walk has enough stops to call."
            >
              {attention.data.tooFewStops.map((item) => (
                <FieldRow key={`${item.fieldId}-${item.pestId}`} item={item} action={attentionAction(item)} />
              ))}
            </Section>
          )}
          <Section
            title="Due a walk"
            count={attention.data.rescoutDue.length}
            tone="bg-straw-300 text-soil-900"
            empty="Every field was walked within its pest’s re-scout interval."
          >
            {attention.data.rescoutDue.map((item) => (
              <RescoutRow key={`${item.fieldId}-${item.pestId}`} item={item} />
            ))}
          </Section>
          <Section
            title="Sightings not yet checked"
            count={attention.data.notYetChecked.length}
            tone="bg-straw-300 text-soil-900"
            empty="Every field’s latest sightings have been checked."
          >
            {attention.data.notYetChecked.map((item) => (
              <FieldRow key={`${item.fieldId}-${item.pestId}`} item={item} action={attentionAction(item)} />
            ))}
          </Section>
          <Section
            title="Notices not acknowledged"
            count={attention.data.unacknowledgedNotices.length}
            tone="bg-field-100 text-field-900"
            empty="Every notice sent has been acknowledged."
          >
            {attention.data.unacknowledgedNotices.map((n) => (
              <li key={n.noticeId} className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 py-2.5" data-attention="unacknowledged-notice">
                <div>
                  <p className="font-medium text-soil-900">
                    {n.fieldName} <span className="font-normal text-soil-600">· {n.farmName}</span> <span className="text-patch-700">· {n.pestName}</span>
                  </p>
                  <p className="text-sm text-soil-700">{n.message}</p>
                  <p className="text-xs text-soil-500">
                    Sent {n.daysSinceSent} day{n.daysSinceSent === 1 ? '' : 's'} ago · {n.recipientsWaiting} recipient{n.recipientsWaiting === 1 ? '' : 's'}{' '}
                    waiting
                  </p>
                </div>
                <Link to={n.link} className={quietLink}>
                  Open the notice
                </Link>
              </li>
            ))}
          </Section>
        </div>
      )}
    </PageFrame>
  );
}
