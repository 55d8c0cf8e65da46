// The field's latest stored check: its verdict and mean count against the threshold, opening in the review.
import { Link } from 'react-router';
import { reviewWindowPath } from '@shared/attention-links.ts';
import { Panel } from '../../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../../components/query-states.tsx';
import { ButtonLink } from '../../../../components/button.tsx';
import { useFieldChecks } from '../../../../lib/api/get-field-checks.ts';
import { spreadLabels } from '../../../../lib/spread-labels.ts';
import { NeedsConfirmingMark } from '../../../../components/needs-confirming-mark.tsx';

const standing = { above: 'above the threshold', below: 'below the threshold', 'too-close': 'too close to call', 'too-few': 'too few stops to call' } as const;

export function LatestCheckPanel({ fieldId }: { fieldId: string }) {
  const checks = useFieldChecks(fieldId);
  if (checks.isPending)
    return (
      <Panel title="Latest check">
        <LoadingState label="Loading checks…" />
      </Panel>
    );
  if (checks.isError)
    return (
      <Panel title="Latest check">
        <ErrorState error={checks.error} onRetry={() => checks.refetch()} />
      </Panel>
    );
  const latest = checks.data.find((c) => c.status !== 'failed');
  if (!latest)
    return (
      <Panel title="Latest check">
        <EmptyState title="Not checked yet" action={<ButtonLink to={reviewWindowPath(fieldId)}>Review and run a check</ButtonLink>}>
          A pattern check tells whether a pest is patchy here.
        </EmptyState>
      </Panel>
    );
  const t = latest.threshold;
  const href = reviewWindowPath(fieldId, { pest: latest.pestId, from: latest.from, to: latest.to, check: latest.id });
  return (
    <Panel title="Latest check">
      <div className="space-y-1.5 text-sm" data-latest-check={latest.id}>
        <p>
          <Link to={href} className="font-medium text-field-700 underline-offset-2 hover:underline">
            {latest.pestName} · {latest.from ?? 'season start'} – {latest.to ?? 'today'}
          </Link>
        </p>
        <p className="text-base font-semibold text-soil-900" data-latest-verdict={latest.verdict ?? latest.status}>
          {latest.verdict ? spreadLabels[latest.verdict] : latest.status === 'done' ? 'No verdict' : `Check ${latest.status}`}
        </p>
        {t.meanPerStop !== null && t.thresholdBasis === 'mean' && (
          <p className="text-soil-800" data-latest-mean={t.meanPerStop}>
            Mean per stop {t.meanPerStop.toFixed(2)} {t.countUnit}, against an action threshold of {t.actionThreshold}: {standing[t.status]}.
          </p>
        )}
        {t.shareInfested !== null && t.thresholdBasis === 'incidence' && (
          <p className="text-soil-800">
            {Math.round(t.shareInfested * 100)} % of stops infested against {Math.round(t.actionThreshold * 100)} %: {standing[t.status]}.
          </p>
        )}
        <p className="text-xs text-soil-600">
          {latest.sightings} sightings and empty stops from {latest.walkDates.length} walk{latest.walkDates.length === 1 ? '' : 's'}. Threshold source:{' '}
          {t.thresholdSource}.
        </p>
        {!t.thresholdConfirmed && <NeedsConfirmingMark />}
        {checks.data.length > 1 && (
          <p className="text-xs text-soil-600">
            {checks.hasNextPage
              ? 'More earlier checks are'
              : checks.data.length === 2
                ? 'One earlier check is'
                : `${checks.data.length - 1} earlier checks are`}{' '}
            listed in the review, where any two can be compared.
          </p>
        )}
      </div>
    </Panel>
  );
}
