import { sampleVariance, mean } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { chiSquareUpper } from '../../shared/analysis/distributions.ts';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { aggregationFigures, quadratTest } from '../../shared/analysis/quadrat.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';

// An L-shaped field: 300 × 200 m with the 100 × 100 m north-east corner missing, 50,000 m² by plane geometry.
const L_FIELD = createPlanarField([
  [
    [
      [0, 0],
      [300, 0],
      [300, 100],
      [200, 100],
      [200, 200],
      [0, 200],
      [0, 0],
    ],
  ],
]);

describe('quadrat count test', () => {
  it('clips cells to the field so their areas add up to the field area (plane geometry)', () => {
    const xy = simulateCsr(L_FIELD, 200, createRandom(1));
    const result = quadratTest(L_FIELD, xy, 50_000, { cellSizeM: 33, slivers: 'keep' });
    const total = result.cells.reduce((sum, cell) => sum + cell.areaM2, 0);
    expect(total).toBeCloseTo(50_000, 6);
    // The cell at x 198–231, y 99–132 straddles the missing corner: a 33 × 1 m strip below y = 100
    // and a 2 × 32 m strip west of x = 200 lie inside.
    const corner = result.cells.find((cell) => cell.col === 6 && cell.row === 3);
    expect(corner?.areaM2).toBeCloseTo(33 * 1 + 2 * 32, 6);
  });

  it("computes Pearson's χ² with k − 1 degrees of freedom from area-proportional expectations (Pearson 1900)", () => {
    const xy = simulateCsr(L_FIELD, 300, createRandom(2));
    const result = quadratTest(L_FIELD, xy, 50_000, { cellSizeM: 50, slivers: 'keep' });
    const area = result.cells.reduce((sum, cell) => sum + cell.areaM2, 0);
    let chi = 0;
    for (const cell of result.cells) {
      const expected = (300 * cell.areaM2) / area;
      chi += (cell.count - expected) ** 2 / expected;
    }
    expect(result.chiSquare).toBeCloseTo(chi, 9);
    expect(result.df).toBe(result.cells.length - 1);
    const upper = chiSquareUpper(chi, result.df);
    expect(result.upperTailPValue).toBeCloseTo(upper, 12);
    expect(result.pValue).toBeCloseTo(Math.min(1, 2 * Math.min(upper, 1 - upper)), 12);
    expect(result.pValueSides).toBe('two-sided');
  });

  it('merges slivers into a neighbour, keeps or drops them on request, and says which', () => {
    // With 95 m cells the last row (y 190–200) is 10/95 deep: under 10 % of a cell once clipped, so slivers.
    const xy = simulateCsr(L_FIELD, 150, createRandom(3));
    const merged = quadratTest(L_FIELD, xy, 50_000, { cellSizeM: 95, slivers: 'merge' });
    const kept = quadratTest(L_FIELD, xy, 50_000, { cellSizeM: 95, slivers: 'keep' });
    const dropped = quadratTest(L_FIELD, xy, 50_000, { cellSizeM: 95, slivers: 'drop' });
    expect(merged.slivers.sliverCells).toBeGreaterThan(0);
    expect(merged.slivers.merged).toBe(merged.slivers.sliverCells - merged.slivers.dropped);
    expect(merged.cells.length).toBe(kept.cells.length - merged.slivers.merged);
    expect(merged.n).toBe(150 - merged.slivers.sightingsDropped);
    expect(kept.n).toBe(150);
    expect(dropped.n).toBe(150 - dropped.slivers.sightingsDropped);
    expect(dropped.cells.every((cell) => cell.areaM2 >= 0.1 * 95 * 95)).toBe(true);
  });

  it('matches the published aggregation formulas on hand-checkable counts', () => {
    const counts = [0, 1, 5, 0, 2, 8, 0, 0, 3, 1];
    const figures = aggregationFigures(counts);
    const m = mean(counts);
    const s2 = sampleVariance(counts);
    // Variance-to-mean ratio (Fisher 1950) from simple-statistics' mean and sample variance.
    expect(figures.varianceToMean).toBeCloseTo(s2 / m, 12);
    // Morisita (1959): I = q·Σx(x−1) / (N(N−1)) = 10·(0+0+20+0+2+56+0+0+6+0) / (20·19) = 840/380.
    expect(figures.morisita).toBeCloseTo(840 / 380, 12);
    // Lloyd (1967): mean crowding m* = m + (s²/m − 1); patchiness m*/m.
    expect(figures.meanCrowding).toBeCloseTo(m + s2 / m - 1, 12);
    expect(figures.patchiness).toBeCloseTo((m + s2 / m - 1) / m, 12);
    // Negative binomial k by moments (Anscombe 1949): k = m² / (s² − m).
    expect(figures.negativeBinomialK).toBeCloseTo((m * m) / (s2 - m), 12);
  });

  it('warns when expected counts fall below 5 (common practice for χ²)', () => {
    const xy = simulateCsr(L_FIELD, 40, createRandom(4));
    expect(quadratTest(L_FIELD, xy, 50_000).lowExpected).toBe(true);
    const many = simulateCsr(L_FIELD, 4000, createRandom(4));
    expect(quadratTest(L_FIELD, many, 50_000, { cellSizeM: 50 }).lowExpected).toBe(false);
  });
});
