import { describe, expect, it } from 'vitest';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { clarkEvans, donnellyCorrected, nearestNeighbourTest } from '../../shared/analysis/nearest-neighbour.ts';
import { nearestNeighbourDistances, nearestNeighbourDistancesByTree } from '../../shared/analysis/nearest-neighbour-index.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { hexagonalLattice, squareLattice, thomasPattern } from './patterns.ts';

describe('Clark–Evans nearest-neighbour index', () => {
  it('gives R = 2 for a square lattice of spacing d over an area of n·d² (Clark & Evans 1954)', () => {
    const d = 7;
    const xy = squareLattice(20, d);
    const result = nearestNeighbourTest(xy, 400 * d * d, 4 * 20 * d);
    expect(result.meanDistanceM).toBeCloseTo(d, 9);
    expect(result.R).toBeCloseTo(2, 9);
  });

  it('gives the maximum R = 2.1491 for a hexagonal lattice (Clark & Evans 1954)', () => {
    const d = 5;
    const xy = hexagonalLattice(30, 30, d);
    // Each point of a hexagonal lattice owns a rhombus of area (√3/2)·d².
    const area = 900 * (Math.sqrt(3) / 2) * d * d;
    expect(nearestNeighbourTest(xy, area, 0).R).toBeCloseTo(2.1491, 4);
  });

  it('uses the standard error 0.26136·√A / n (Clark & Evans 1954)', () => {
    const figures = clarkEvans(10, 100, 40_000);
    expect(figures.standardErrorM).toBeCloseTo((0.26136 * 200) / 100, 12);
    expect(figures.z).toBeCloseTo((10 - 0.5 * Math.sqrt(400)) / figures.standardErrorM, 12);
  });

  it("applies Donnelly's edge-corrected expectation and standard error (Donnelly 1978)", () => {
    // Worked by hand from Donnelly's constants for n = 100, A = 10,000 m², P = 400 m:
    // E = 0.5·√100 + (0.0514 + 0.0412/10)·400/100 = 5 + 0.22208 = 5.22208 m
    // SE = √(0.0703·10⁴/10⁴ + 0.037·400·√(10⁴/10¹⁰)) = √(0.0703 + 0.0148) = 0.2917190 m
    const figures = donnellyCorrected(5, 100, 10_000, 400);
    expect(figures.expectedDistanceM).toBeCloseTo(5.22208, 10);
    expect(figures.standardErrorM).toBeCloseTo(0.291719, 6);
  });

  it('finds the same nearest neighbours as a brute-force scan, for scattered and bunched points', () => {
    const random = createRandom(11);
    const scattered = new Float64Array(1500 * 2).map(() => random() * 500);
    const field = createPlanarField([
      [
        [
          [0, 0],
          [500, 0],
          [500, 500],
          [0, 500],
          [0, 0],
        ],
      ],
    ]);
    const bunched = thomasPattern(field, 3, 400, 0.5, 4);
    for (const xy of [scattered, bunched]) {
      const n = xy.length / 2;
      const brute = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        let best = Infinity;
        for (let j = 0; j < n; j++) if (j !== i) best = Math.min(best, Math.hypot(xy[i * 2] - xy[j * 2], xy[i * 2 + 1] - xy[j * 2 + 1]));
        brute[i] = best;
      }
      const grid = nearestNeighbourDistances(xy);
      const tree = nearestNeighbourDistancesByTree(xy);
      for (let i = 0; i < n; i++) {
        expect(grid[i]).toBeCloseTo(brute[i], 9);
        expect(tree[i]).toBeCloseTo(brute[i], 9);
      }
    }
  });
});
