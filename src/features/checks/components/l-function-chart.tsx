// Ripley's L against distance with the Monte Carlo envelope: where L rises above the band, sightings
// cluster at that distance. Drawn (l-function-plot.tsx, loaded on demand) from the engine's own L and envelope arrays.
import { lazy, Suspense } from 'react';
import type { RipleyResult } from '@shared/analysis/ripley.ts';
import { fixed } from '../utils/figures.ts';
import { SectionTitle } from './figure-list.tsx';
import { ChartPlaceholder } from './chart-placeholder.tsx';

const LFunctionPlot = lazy(() => import('./l-function-plot.tsx').then((m) => ({ default: m.LFunctionPlot })));

function rangeText(radii: number[]) {
  return radii.length === 1 ? `${fixed(radii[0], 0)} m` : `${fixed(radii[0], 0)}–${fixed(radii[radii.length - 1], 0)} m`;
}

export function LFunctionChart({ ripley }: { ripley: RipleyResult | null }) {
  if (!ripley) {
    return (
      <section>
        <SectionTitle source="Ripley 1976, 1977">Clustering by distance</SectionTitle>
        <p className="py-2 text-sm text-soil-600">Needs at least two sightings inside the field.</p>
      </section>
    );
  }
  const reading = ripley.aboveEnvelopeM.length
    ? `L rises above the random band at ${rangeText(ripley.aboveEnvelopeM)}: sightings gather together at that scale — about the size of a patch.`
    : ripley.belowEnvelopeM.length
      ? `L falls below the random band at ${rangeText(ripley.belowEnvelopeM)}: sightings keep apart at that scale.`
      : ripley.envelopeHigh
        ? `L stays inside the random band up to ${fixed(ripley.radiiM[ripley.radiiM.length - 1], 0)} m: no distance shows clustering.`
        : 'No random band was simulated (0 simulations): read L against the chance line only.';
  return (
    <section aria-labelledby="ripley-title">
      <SectionTitle source={`Ripley 1976, 1977 · ${ripley.correction} edge correction · ${ripley.simulations} simulations`}>
        <span id="ripley-title">Clustering by distance (L function)</span>
      </SectionTitle>
      <figure className="h-64" aria-label="L function chart: L of r against distance r, with the random envelope and the chance line" data-chart="l-function">
        <Suspense fallback={<ChartPlaceholder />}>
          <LFunctionPlot ripley={ripley} />
        </Suspense>
      </figure>
      <p className="mt-1 text-xs text-soil-700">{reading}</p>
    </section>
  );
}
