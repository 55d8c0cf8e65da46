// Two stored checks side by side: which check is the earlier, what a change reads as, and when a row counts as changed.
import { describe, expect, it } from 'vitest';
import type { CheckSummary } from '../../../shared/schemas/checks.ts';
import { analysisOptionsSchema } from '../../../shared/analysis/options.ts';
import { compareChecks, inRunOrder } from '../../../src/features/checks/check-comparison.ts';

function summary(change: Partial<Omit<CheckSummary, 'figures'>> & { figures?: Partial<CheckSummary['figures']> } = {}): CheckSummary {
  const base: CheckSummary = {
    id: 'a',
    fieldId: 'f',
    pestId: 'p',
    pestName: 'Test aphid',
    from: null,
    to: null,
    status: 'done',
    progress: 1,
    verdict: 'clustered',
    n: 10,
    engineVersion: 'test',
    createdBy: { id: 'u', name: 'Adviser' },
    createdAt: '2026-07-01T10:00:00.000Z',
    finishedAt: '2026-07-01T10:00:01.000Z',
    options: analysisOptionsSchema.parse({}),
    design: 'stops',
    sightings: 40,
    walkDates: ['2026-07-01'],
    figures: { stops: 40, emptyStops: 30, clarkEvansR: 0.5, donnellyR: 0.52, moranI: 0.3, zoneCount: 2, zonesM2: 12_000, notScoutedM2: 0 },
    threshold: {
      meanPerStop: 1.2,
      shareInfested: 0.25,
      actionThreshold: 2,
      thresholdBasis: 'mean',
      thresholdSource: 'test',
      thresholdConfirmed: true,
      countUnit: 'aphids per plant',
      status: 'below',
    },
  };
  return { ...base, ...change, figures: { ...base.figures, ...change.figures } };
}

const row = (rows: ReturnType<typeof compareChecks>, key: string) => rows.find((r) => r.key === key)!;

describe('two checks compared', () => {
  it('puts the check run first on the left whichever was chosen first', () => {
    const early = summary({ id: 'early', createdAt: '2026-07-01T10:00:00.000Z' });
    const late = summary({ id: 'late', createdAt: '2026-07-08T10:00:00.000Z' });
    expect(inRunOrder(late, early).map((c) => c.id)).toEqual(['early', 'late']);
    expect(inRunOrder(early, late).map((c) => c.id)).toEqual(['early', 'late']);
  });

  it('reads a change as the later figure less the earlier, with a true minus sign, and marks it', () => {
    const rows = compareChecks(summary({ sightings: 40 }), summary({ sightings: 33, figures: { clarkEvansR: 0.625 } }));
    expect(row(rows, 'sightings')).toMatchObject({ earlier: '40', later: '33', change: '−7', changed: true });
    expect(row(rows, 'R')).toMatchObject({ earlier: '0.500', later: '0.625', change: '+0.125', changed: true });
  });

  it('does not call a difference smaller than the digits shown a change', () => {
    const rows = compareChecks(summary({ figures: { moranI: 0.3001 } }), summary({ figures: { moranI: 0.3004 } }));
    expect(row(rows, 'moran-I')).toMatchObject({ change: 'same', changed: false });
  });

  it('shows zones’ area in hectares, a check without zones as 0 ha, and a missing figure as a dash', () => {
    const rows = compareChecks(summary({ figures: { zonesM2: 12_000 } }), summary({ figures: { zoneCount: 0, zonesM2: null, moranI: null } }));
    expect(row(rows, 'zones-ha')).toMatchObject({ earlier: '1.20', later: '0.00', change: '−1.20', changed: true });
    expect(row(rows, 'moran-I')).toMatchObject({ later: '—', change: '—', changed: true });
  });

  it('names a changed verdict and window in words', () => {
    const rows = compareChecks(summary({ verdict: 'clustered' }), summary({ verdict: 'random', to: '2026-07-01' }));
    expect(row(rows, 'verdict')).toMatchObject({ earlier: 'Clustered', later: 'Random', change: 'changed', changed: true });
    // The default locale en-GB writes 2026-07-01 as "1 July 2026" (CLDR long date pattern "d MMMM y").
    expect(row(rows, 'window')).toMatchObject({ earlier: 'season start – today', later: 'season start – 1 July 2026', changed: true });
    expect(row(rows, 'threshold')).toMatchObject({ changed: false });
  });
});
