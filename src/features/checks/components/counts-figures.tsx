// Moran's I and Getis–Ord Gi* hot patches: whether heavy counts sit together, not just where sightings are.
import type { CheckFigures } from '@shared/schemas/checks.ts';
import type { CoverageResult } from '@shared/analysis/coverage.ts';
import { fixed, metres, percent, pText } from '../utils/figures.ts';
import { explainMoran } from '../utils/explanations.ts';
import { Figure, FigureList, SectionTitle, Warning } from './figure-list.tsx';
import { StopFigures } from './stop-figures.tsx';
import type { ComponentProps } from 'react';

export function CountsFigures({
  counts,
  alpha,
  stopFigures,
}: {
  counts: CheckFigures['counts'];
  alpha: number;
  /** Where the per-stop table fetches its figures and how it points at a stop on the map. */
  stopFigures: ComponentProps<typeof StopFigures>;
}) {
  return (
    <section aria-labelledby="counts-title">
      <SectionTitle source="Moran 1950; Getis & Ord 1992, Ord & Getis 1995; Benjamini–Hochberg">
        <span id="counts-title">Heavy counts together?</span>
      </SectionTitle>
      {!counts ? (
        <p className="py-2 text-sm text-soil-600">Needs counts on at least four stops (empty stops count as 0).</p>
      ) : (
        <FigureList label="Count figures">
          <Figure name="Stops with a count" value={counts.stops} figure="count-stops">
            Counted sightings and empty stops (0) used here; neighbours are stops within {metres(counts.moran.bandM, 0)}.
          </Figure>
          <Figure name="Moran's I" value={fixed(counts.moran.I, 3)} figure="moran-I">
            {explainMoran(counts.moran, alpha)}
          </Figure>
          <Figure name="Expected I · z" value={`${fixed(counts.moran.expected, 3)} · ${fixed(counts.moran.z)}`} figure="moran-z">
            I for counts placed at random is −1/(n−1); z measures the distance from it.
          </Figure>
          <Figure name="p (permutation)" value={pText(counts.moran.pValue ?? counts.moran.normalPValue)} figure="moran-p">
            {counts.moran.pValue !== null
              ? `From ${counts.moran.permutations} reshuffles of the counts over the same stops.`
              : 'Normal approximation (no reshuffles run).'}
          </Figure>
          <Figure name="Hot patches" value={counts.hotPatches.length} figure="hot-patches">
            {counts.hotPatches.length
              ? counts.hotPatches.map((p, i) => `Patch ${i + 1}: ${p.sightings} stops, mean count ${fixed(p.meanCount, 1)}`).join('; ') +
                '. Stops whose neighbourhood counts are high beyond chance, after allowing for testing many stops at once.'
              : 'No group of stops has counts high beyond chance once many stops are tested at once.'}
          </Figure>
        </FigureList>
      )}
      {counts && <StopFigures {...stopFigures} />}
    </section>
  );
}

export function CoverageFigures({ coverage }: { coverage: CoverageResult | null }) {
  return (
    <section aria-labelledby="coverage-title">
      <SectionTitle source="Patchwise coverage rules">
        <span id="coverage-title">How evenly the field was walked</span>
      </SectionTitle>
      {!coverage ? (
        <p className="py-2 text-sm text-soil-600">Needs at least four stops to judge coverage.</p>
      ) : (
        <>
          <FigureList label="Coverage figures">
            <Figure name="Stops" value={coverage.stops} figure="coverage-stops">
              Every stop (sightings and {coverage.emptyStops} empty stops). Sightings exist only where a scout looked.
            </Figure>
            <Figure name="Cells visited" value={percent(coverage.visitedShare)} figure="visited-share">
              Share of {metres(coverage.cellSizeM, 0)} cells with at least one stop; an even walk with as many stops would reach about{' '}
              {percent(coverage.expectedVisitedShare)}.
            </Figure>
            <Figure name="Spacing of stops (R)" value={fixed(coverage.stopsR)} figure="stops-R">
              Near or above 1: stops spread over the field. Well below 1: the walk itself bunched up, which can look like a patch.
            </Figure>
          </FigureList>
          {coverage.warnings.map((w) => (
            <Warning key={w}>{w}</Warning>
          ))}
        </>
      )}
    </section>
  );
}
