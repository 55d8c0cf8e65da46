// Each walk against the pest's action threshold: above, below or too close to call, with the mean, its
// interval, the threshold and its source; the share of stops infested where the rule is about incidence.
import type { WalkThresholdStatus } from '@shared/schemas/checks.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useThresholdStatus } from '../api/get-threshold-status.ts';
import { fixed, percent } from '../utils/figures.ts';
import { countWithUnit } from '@shared/units/count-unit.ts';
import { NeedsConfirmingMark } from '../../../components/needs-confirming-mark.tsx';
import { NEEDS_CONFIRMING, unconfirmedThresholdSentence } from '@shared/thresholds/threshold-confirmation.ts';
import { useDates } from '../../../lib/dates.ts';

const statusText = {
  above: 'Above threshold',
  below: 'Below threshold',
  'too-close': 'Too close to call — scout again',
  'too-few': 'Too few stops to call',
} as const;
const statusTone = {
  above: 'bg-patch-600 text-white',
  below: 'bg-field-100 text-field-900',
  'too-close': 'bg-straw-200 text-soil-900',
  'too-few': 'bg-straw-200 text-soil-900',
} as const;

function Figures({ s }: { s: WalkThresholdStatus }) {
  if (s.thresholdBasis === 'incidence') {
    return (
      <>
        <td className="px-2 py-1.5 text-right tabular-nums">
          {percent(s.shareInfested)}{' '}
          <span className="text-soil-500">
            ({s.infestedStops}/{s.stops})
          </span>
        </td>
        <td className="px-2 py-1.5 tabular-nums">{s.shareInterval ? `${percent(s.shareInterval.low)}–${percent(s.shareInterval.high)}` : '—'}</td>
        <td className="px-2 py-1.5 text-right tabular-nums">{percent(s.actionThreshold)} infested</td>
      </>
    );
  }
  return (
    <>
      <td className="px-2 py-1.5 text-right tabular-nums">
        {fixed(s.meanPerStop)} <span className="text-soil-500">({s.countedStops} stops)</span>
      </td>
      <td className="px-2 py-1.5 tabular-nums">{s.meanInterval ? `${fixed(s.meanInterval.low)}–${fixed(s.meanInterval.high)}` : '—'}</td>
      <td className="px-2 py-1.5 text-right tabular-nums">
        {countWithUnit(s.actionThreshold, s.countUnit, (v) => v.toLocaleString('en-GB', { maximumFractionDigits: 4 }))}
        {!s.thresholdConfirmed && (
          <span className="ml-1 whitespace-nowrap rounded bg-straw-200 px-1 text-xs font-semibold text-soil-900">{NEEDS_CONFIRMING}</span>
        )}
      </td>
    </>
  );
}

/** The pests whose threshold waits for the admin, each named once. */
const unconfirmedPestNames = (statuses: WalkThresholdStatus[]) => [...new Set(statuses.filter((s) => !s.thresholdConfirmed).map((s) => s.pestName))].join(', ');

export function ThresholdStatusPanel({ fieldId, pestId }: { fieldId: string; pestId?: string }) {
  const dates = useDates();
  const statuses = useThresholdStatus(fieldId, pestId);
  return (
    <Panel title="Against the action threshold">
      {statuses.isPending ? (
        <LoadingState label="Loading threshold status…" />
      ) : statuses.isError ? (
        <ErrorState error={statuses.error} onRetry={() => statuses.refetch()} />
      ) : statuses.data.length === 0 ? (
        <EmptyState title="No walks for this pest yet">Each walk appears here once its stops are recorded.</EmptyState>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Threshold status per walk and pest</caption>
            <thead className="bg-straw-100 text-xs text-soil-700">
              <tr>
                <th scope="col" className="px-2 py-1.5">
                  Walk
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Pest
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Status
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Mean / share
                </th>
                <th scope="col" className="px-2 py-1.5">
                  95 % interval
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Threshold
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-straw-200">
              {statuses.data.map((s) => (
                <tr key={`${s.walkId}-${s.pestId}`} data-threshold-status={s.status}>
                  <td className="whitespace-nowrap px-2 py-1.5">{dates.calendarDate(s.walkedOn)}</td>
                  <td className="px-2 py-1.5">{s.pestName}</td>
                  <td className="px-2 py-1.5">
                    <span className={`inline-block whitespace-nowrap rounded px-1.5 py-0.5 text-xs font-semibold ${statusTone[s.status]}`}>
                      {statusText[s.status]}
                    </span>
                  </td>
                  <Figures s={s} />
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-2 text-xs text-soil-700">
            The 95 % interval of a mean count per stop is Garwood’s exact Poisson interval (Garwood 1936), widened by the dispersion when counts vary more
            between stops than chance would (quasi-Poisson, McCullagh &amp; Nelder 1989); the share of stops infested uses Wilson’s interval (Wilson 1927).
          </p>
          {statuses.data.some((s) => !s.thresholdConfirmed) && (
            <NeedsConfirmingMark className="mt-2" sentence={`${unconfirmedPestNames(statuses.data)}: ${unconfirmedThresholdSentence}`} />
          )}
          <ul className="mt-2 space-y-1 text-xs text-soil-700">
            {statuses.data.map((s) => (
              <li key={`${s.walkId}-${s.pestId}`}>
                <span className="font-medium">{dates.calendarDate(s.walkedOn)}:</span> {s.sentence}
              </li>
            ))}
          </ul>
        </div>
      )}
    </Panel>
  );
}
