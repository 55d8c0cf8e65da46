// The end of a walk: how many stops, how many found the pest, the route walked and how evenly the field was covered.
import type { Actor } from '../auth/passport.ts';
import type { WalkSummary } from '../../shared/schemas/walks.ts';
import type { CoverageResult } from '../../shared/analysis/coverage.ts';
import { routeLengthM } from '../../shared/units/route-length.ts';
import { liveSightingsOfWalkInTimeOrder } from '../queries/sightings.ts';
import { writableWalk } from './ingest-access.ts';
import { fieldBoundary, sightingsCollection } from './check-runner.ts';
import { runInAnalysisThread } from './analysis-pool.ts';

const pct = (share: number) => `${Math.round(share * 100)} %`;

/** One plain sentence on the engine's coverage figures (shared/analysis/coverage.ts). */
export function evennessSentence(coverage: CoverageResult | null): string {
  if (!coverage) return 'Too few stops to judge how evenly the field was covered: it takes at least four.';
  const verdict = coverage.uneven ? 'so parts of the field were left out' : 'so the field was covered about evenly';
  return (
    `The stops reached ${pct(coverage.visitedShare)} of the field's ${Math.round(coverage.cellSizeM)} m squares, against about ` +
    `${pct(coverage.expectedVisitedShare)} for as many stops spread at random over the field, ${verdict}.`
  );
}

/** The walk's summary for its scout or an adviser; a grower has none, another scout's walk is refused. */
export async function walkSummary(actor: Actor, walkId: string): Promise<WalkSummary> {
  // Those who may add to the walk are those who may finish it: desk roles and the walk's own scout.
  const walk = await writableWalk(actor, walkId);
  const sightings = await liveSightingsOfWalkInTimeOrder(walk.id);
  const routeM = routeLengthM(sightings);
  if (sightings.length === 0) {
    return { walkId, sightings: 0, stops: 0, found: 0, empty: 0, routeLengthM: 0, coverage: null, evenness: evennessSentence(null) };
  }
  const answer = await runInAnalysisThread({ kind: 'walk-coverage', boundary: await fieldBoundary(walk.fieldId), sightings: sightingsCollection(sightings) });
  const { coverage } = answer;
  return {
    walkId,
    sightings: sightings.length,
    stops: answer.stops.count,
    found: answer.stops.found,
    empty: answer.stops.empty,
    routeLengthM: routeM,
    coverage: coverage && {
      cellSizeM: coverage.cellSizeM,
      visitedShare: coverage.visitedShare,
      expectedVisitedShare: coverage.expectedVisitedShare,
      stopsR: coverage.stopsR,
      uneven: coverage.uneven,
      warnings: coverage.warnings,
    },
    evenness: evennessSentence(coverage),
  };
}
