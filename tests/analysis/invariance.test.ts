// Spread figures are properties of the pattern, not of where or how it is drawn.
import { describe, expect, it } from 'vitest';
import { analyse } from '../../shared/analysis/analyse.ts';
import { isInsideField } from '../../shared/analysis/field-geometry.ts';
import { asFeatureCollection, irregularField, IRREGULAR_FIELD_RING, thomasPattern } from './patterns.ts';

/** Empty stops on a 50 m lattice inside the field: the stops design needs them. */
const EMPTY_STOPS = (() => {
  const field = irregularField();
  const out: number[] = [];
  for (let x = 25; x < 760; x += 50) for (let y = 25; y < 500; y += 50) if (isInsideField(field, x, y)) out.push(x, y);
  return new Float64Array(out);
})();

type Transform = (x: number, y: number) => [number, number];

function run(transform: Transform, xy: Float64Array, grid?: { nx: number; ny: number }) {
  const ring = IRREGULAR_FIELD_RING.map(([x, y]) => transform(x, y));
  const moved = new Float64Array(xy.length);
  for (let i = 0; i < xy.length; i += 2) [moved[i], moved[i + 1]] = transform(xy[i], xy[i + 1]);
  const empty = new Float64Array(EMPTY_STOPS.length);
  for (let i = 0; i < EMPTY_STOPS.length; i += 2) [empty[i], empty[i + 1]] = transform(EMPTY_STOPS[i], EMPTY_STOPS[i + 1]);
  const sightings = asFeatureCollection(
    moved,
    Array.from({ length: moved.length / 2 }, () => 1),
  );
  sightings.features.push(
    ...asFeatureCollection(
      empty,
      Array.from({ length: empty.length / 2 }, () => 0),
    ).features.map((f, i) => ({ ...f, properties: { ...f.properties, id: `e${i}` } })),
  );
  // Merging off: a fixed same-stop radius in metres is not scale-invariant.
  return analyse({ type: 'Polygon', coordinates: [ring] }, sightings, { planar: true, simulations: 99, seed: 4, grid, stopRadiusM: 0 });
}

describe('invariance of the spread figures', () => {
  const xy = thomasPattern(irregularField(), 6, 15, 15, 9);
  const base = run((x, y) => [x, y], xy);
  const baseGrid = run((x, y) => [x, y], xy, { nx: 6, ny: 4 });
  const angle = 0.7;
  const cases: Array<[string, Transform, boolean, { nx: number; ny: number } | undefined]> = [
    ['translation', (x, y) => [x + 512_345.5, y + 4_300_210.25], true, undefined],
    ['uniform scaling', (x, y) => [x * 2.5, y * 2.5], true, undefined],
    // A 6 × 4 grid over the bounding box turns into a 4 × 6 grid.
    ['rotation by 90°', (x, y) => [-y, x], true, { nx: 4, ny: 6 }],
    ['rotation by 0.7 rad', (x, y) => [x * Math.cos(angle) - y * Math.sin(angle), x * Math.sin(angle) + y * Math.cos(angle)], false, undefined],
  ];
  for (const [name, transform, gridAligned, grid] of cases) {
    it(`leaves R${gridAligned ? ', χ²' : ''} and the verdict unchanged under ${name}`, () => {
      const moved = run(transform, xy, grid);
      const reference = grid ? baseGrid : base;
      expect(moved.nearestNeighbour?.R).toBeCloseTo(base.nearestNeighbour?.R as number, 9);
      expect(moved.nearestNeighbour?.donnelly.R).toBeCloseTo(base.nearestNeighbour?.donnelly.R as number, 9);
      expect(moved.spread.verdict).toBe(base.spread.verdict);
      // Quadrat cells are laid north–south from the field's south-west corner, so χ² is invariant only
      // under moves that map that grid onto itself; an oblique rotation lays a different grid.
      if (gridAligned) expect(moved.quadrat?.chiSquare).toBeCloseTo(reference.quadrat?.chiSquare as number, 6);
    });
  }
  it('finds the test pattern clustered in the first place', () => {
    expect(base.spread.verdict).toBe('clustered');
  });
});
