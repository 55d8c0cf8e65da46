// The spread verdict in words, with the engine's own sentences behind it; never a bare label.
import type { CheckFigures, CheckView } from '@shared/schemas/checks.ts';
import { areaBasisLabels } from '../utils/figures.ts';
import { useDates } from '../../../lib/dates.ts';
import { spreadLabels } from '../../../lib/spread-labels.ts';

const tone: Record<CheckFigures['spread']['verdict'], string> = {
  clustered: 'bg-patch-600 text-white',
  random: 'bg-field-100 text-field-900 ring-1 ring-inset ring-field-300',
  regular: 'bg-straw-200 text-soil-900 ring-1 ring-inset ring-straw-400',
  'too-few': 'bg-soil-300/40 text-soil-800 ring-1 ring-inset ring-soil-300',
  everywhere: 'bg-patch-100 text-patch-700 ring-1 ring-inset ring-patch-400',
  'cant-tell': 'bg-soil-300/40 text-soil-800 ring-1 ring-inset ring-soil-300',
};

const meaning: Record<CheckFigures['spread']['verdict'], string> = {
  clustered: 'The pest is patchy: spot treatment of the patches is worth considering.',
  random: 'No pattern beyond chance: the pest is scattered across the field.',
  regular: 'More even than chance: the pest is spread everywhere, not in patches.',
  'too-few': 'Too few sightings to tell a patch from chance: scout again before deciding.',
  everywhere: 'The pest was found at most stops: decide for the whole field against the action threshold, not by patches.',
  'cant-tell': 'The data cannot separate the walk from the pest: no zone is proposed. Record empty stops and cover the field evenly.',
};

const designWords = {
  stops: 'Stops design: empty stops were recorded, so the pest is compared with the places the scout stopped.',
  'whole-field': 'Whole-field design: photos only, no empty stops, so the check assumes the whole field was searched evenly.',
} as const;

export function VerdictSummary({ check, result }: { check: CheckView; result: CheckFigures }) {
  const dates = useDates();
  const { spread } = result;
  // Results stored before the design was stated carry no evidence list: their reasons stand as they were.
  const primary = spread.evidence?.find((e) => e.role === 'primary');
  const supporting = spread.evidence?.filter((e) => e.role === 'supporting') ?? [];
  return (
    <div className="space-y-2" data-verdict={spread.verdict}>
      <div className="flex flex-wrap items-center gap-3">
        <p className={`rounded-md px-3 py-1.5 text-lg font-semibold ${tone[spread.verdict]}`} aria-label={`Spread: ${spreadLabels[spread.verdict]}`}>
          {spreadLabels[spread.verdict]}
        </p>
        <p className="text-sm text-soil-800">{meaning[spread.verdict]}</p>
      </div>
      {result.design && (
        <p className="text-sm font-medium text-soil-900" data-design={result.design}>
          {designWords[result.design]}
        </p>
      )}
      {primary && (
        <p className="text-sm text-soil-900" data-primary-test>
          <span className="font-semibold">{spread.headline}.</span> {primary.text}
        </p>
      )}
      <p className="text-xs text-soil-600">
        At α = {spread.alpha}, on the {areaBasisLabels[result.area.basis].toLowerCase()};{' '}
        {spread.decidedBy === 'random-labelling'
          ? 'decided by relabelling the same stops'
          : spread.decidedBy === 'monte-carlo'
            ? 'decided by the Monte Carlo p inside the boundary'
            : spread.decidedBy === 'donnelly'
              ? 'decided by the edge-corrected normal p'
              : `the check needs at least ${spread.minSightings} sightings`}
        . Check run by {check.createdBy.name}, {dates.dateTime(check.createdAt)}
        {check.reused ? ' · stored result (same sightings and options)' : ''}.
      </p>
      <details className="text-xs text-soil-600" data-technical-details>
        <summary className="cursor-pointer">Technical details</summary>
        <p>
          Engine version {result.engineVersion}; distances measured in the projection {result.crs}.
        </p>
      </details>
      {primary ? (
        supporting.length > 0 && (
          <div>
            <p className="text-xs font-semibold uppercase tracking-wide text-soil-600">Supporting evidence (not the verdict)</p>
            <ul className="list-disc space-y-1 pl-5 text-sm text-soil-800">
              {supporting.map((e) => (
                <li key={e.text}>{e.text.replace(/^Supporting evidence, not the verdict: /, '')}</li>
              ))}
            </ul>
          </div>
        )
      ) : (
        <ul className="list-disc space-y-1 pl-5 text-sm text-soil-800">
          {spread.reasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
