// Clark–Evans figures on the chosen area basis, with Donnelly's edge correction and the Monte Carlo p.
import type { CheckFigures } from '@shared/schemas/checks.ts';
import { areaBasisLabels, fixed, hectaresAndAcres, metres, pText } from '../utils/figures.ts';
import { explainDonnelly, explainMeanDistance, explainMonteCarlo, explainP, explainR, explainZ } from '../utils/explanations.ts';
import { Figure, FigureList, SectionTitle, Warning } from './figure-list.tsx';

export function NearestNeighbourFigures({ result }: { result: CheckFigures }) {
  const nearest = result.nearestNeighbour;
  const { area, spread } = result;
  const alpha = spread.alpha;
  return (
    <section aria-labelledby="nearest-title">
      <SectionTitle source="Clark & Evans 1954; Donnelly 1978">
        <span id="nearest-title">Spacing of sightings</span>
      </SectionTitle>
      <FigureList label="Nearest-neighbour figures">
        <Figure name="Sightings (n)" value={result.n} figure="n">
          Found sightings inside the field in this window{result.emptyStops ? `; ${result.emptyStops} empty stops are left out of the spacing test` : ''}
          {result.excluded.count ? `; ${result.excluded.count} outside the boundary were left out` : ''}.
        </Figure>
        <Figure name="Area basis" value={<span className="text-xs font-medium">{areaBasisLabels[area.basis]}</span>} figure="area-basis">
          The area the test assumes the pest could be anywhere in. Chance spacing depends on it: a smaller area makes the same sightings look less clustered.
        </Figure>
        <Figure name="Area used" value={<span className="whitespace-nowrap text-xs">{hectaresAndAcres(area.usedM2)}</span>} figure="area-used">
          Field boundary {hectaresAndAcres(area.boundaryM2)}; bounding rectangle {hectaresAndAcres(area.boundingBoxM2)}; hull{' '}
          {hectaresAndAcres(area.convexHullM2)}.
        </Figure>
        {nearest ? (
          <>
            <Figure name="Mean nearest distance" value={metres(nearest.meanDistanceM)} figure="mean-distance">
              {explainMeanDistance(nearest)}
            </Figure>
            <Figure name="Expected distance" value={metres(nearest.expectedDistanceM)} figure="expected-distance">
              The spacing a chance scatter of {nearest.n} sightings over the area used would give.
            </Figure>
            <Figure name="R (Clark–Evans)" value={fixed(nearest.R, 3)} figure="R">
              {explainR(nearest.R, nearest.pValue, alpha)}
            </Figure>
            <Figure name="z" value={fixed(nearest.z)} figure="z">
              {explainZ(nearest.z)}
            </Figure>
            <Figure name="p (normal)" value={pText(nearest.pValue)} figure="p">
              {explainP(nearest.pValue, alpha)}
            </Figure>
            <Figure name="R, edge-corrected" value={fixed(nearest.donnelly.R, 3)} figure="donnelly-R">
              {explainDonnelly(nearest)}
            </Figure>
            <Figure name="Edge-corrected z" value={fixed(nearest.donnelly.z)} figure="donnelly-z">
              Expected spacing with the edge allowed for: {metres(nearest.donnelly.expectedDistanceM)}.
            </Figure>
            <Figure name="Edge-corrected p" value={pText(nearest.donnelly.pValue)} figure="donnelly-p">
              The normal p of the edge-corrected test; used for the verdict only when no random scatters were simulated.
            </Figure>
            <Figure name="Monte Carlo p" value={pText(nearest.monteCarlo.pValue)} figure="monte-carlo-p">
              {explainMonteCarlo(nearest, alpha)}
            </Figure>
          </>
        ) : (
          <Figure name="Spacing test" value="—">
            Needs at least two sightings inside the field.
          </Figure>
        )}
      </FigureList>
      {area.basis !== 'boundary' && (
        <Warning>The area basis is not the field boundary; compare with the boundary figures in the robustness strip below before deciding.</Warning>
      )}
    </section>
  );
}
