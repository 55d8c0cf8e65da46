// Every figure behind the verdict, grouped by test, each with its plain-words reading.
import type { CheckFigures } from '@shared/schemas/checks.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { Panel } from '../../../components/page-frame.tsx';
import { NearestNeighbourFigures } from './nearest-neighbour-figures.tsx';
import { QuadratFigures } from './quadrat-figures.tsx';
import { LFunctionChart } from './l-function-chart.tsx';
import { CountsFigures, CoverageFigures } from './counts-figures.tsx';
import { ZonesFigures } from './zones-figures.tsx';

export function CheckEvidence({
  result,
  checkId,
  sightings,
  zoneEditorPath,
  onShowOnMap,
}: {
  result: CheckFigures;
  checkId: string;
  sightings: SightingView[];
  zoneEditorPath: string;
  onShowOnMap: (sightingId: string) => void;
}) {
  const alpha = result.spread.alpha;
  return (
    <Panel title="The evidence">
      <div className="grid gap-x-8 gap-y-6 xl:grid-cols-2">
        <NearestNeighbourFigures result={result} />
        <div className="space-y-6">
          <LFunctionChart ripley={result.ripley} />
          <QuadratFigures quadrat={result.quadrat} alpha={alpha} />
        </div>
        <CountsFigures counts={result.counts} alpha={alpha} stopFigures={{ checkId, sightings, onShowOnMap }} />
        <CoverageFigures coverage={result.coverage} />
        <ZonesFigures result={result} zoneEditorPath={zoneEditorPath} />
      </div>
    </Panel>
  );
}
