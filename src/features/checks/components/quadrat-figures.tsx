// The quadrat count test over square cells clipped to the field.
import type { CheckFigures } from '@shared/schemas/checks.ts';
import { fixed, metres, pText } from '../utils/figures.ts';
import { explainChiSquare, explainMorisita, explainVarianceToMean } from '../utils/explanations.ts';
import { Figure, FigureList, SectionTitle, Warning } from './figure-list.tsx';

export function QuadratFigures({ quadrat, alpha }: { quadrat: CheckFigures['quadrat']; alpha: number }) {
  return (
    <section aria-labelledby="quadrat-title">
      <SectionTitle source="Pearson χ²; index of dispersion; Morisita 1959">
        <span id="quadrat-title">Counts per cell</span>
      </SectionTitle>
      {!quadrat ? (
        <p className="py-2 text-sm text-soil-600">Needs at least two sightings inside the field.</p>
      ) : (
        <>
          <FigureList label="Quadrat figures">
            <Figure name="Cell size" value={metres(quadrat.grid.cellWidth, 0)} figure="cell-size">
              {quadrat.cellCount} cells over the field ({quadrat.fullCells} whole, the rest clipped by the boundary), {fixed(quadrat.meanPerFullCell)} sightings
              per whole cell on average.
            </Figure>
            <Figure name="χ²" value={fixed(quadrat.chiSquare, 1)} figure="chi-square">
              {explainChiSquare(quadrat, alpha)}
            </Figure>
            <Figure name="Degrees of freedom" value={quadrat.df} figure="df">
              Cells minus one: how many cell counts are free to vary once the total is known.
            </Figure>
            <Figure name="p (χ²)" value={pText(quadrat.pValue)} figure="quadrat-p">
              {quadrat.pValue < alpha ? `Below your α of ${alpha}: the counts are uneven beyond chance.` : `Not below your α of ${alpha}.`}
            </Figure>
            <Figure name="Variance ÷ mean" value={fixed(quadrat.varianceToMean)} figure="variance-to-mean">
              {explainVarianceToMean(quadrat.varianceToMean)}
              {quadrat.dispersionPValue !== null && ` (p ${pText(quadrat.dispersionPValue)})`}
            </Figure>
            <Figure name="Morisita's index" value={fixed(quadrat.morisita)} figure="morisita">
              {explainMorisita(quadrat.morisita)}
            </Figure>
          </FigureList>
          {quadrat.lowExpected && <Warning>Some cells expect fewer than 5 sightings, so the χ² p is rough; larger cells make it firmer.</Warning>}
          {quadrat.slivers.sliverCells > 0 && (
            <p className="mt-1 text-xs text-soil-600">
              {quadrat.slivers.sliverCells} sliver cells at the edge (under 10 % inside the field): {quadrat.slivers.merged} merged into a neighbour,{' '}
              {quadrat.slivers.dropped} dropped
              {quadrat.slivers.sightingsDropped ? ` with ${quadrat.slivers.sightingsDropped} sightings` : ''}.
            </p>
          )}
        </>
      )}
    </section>
  );
}
