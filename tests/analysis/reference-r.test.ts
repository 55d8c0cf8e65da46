// The engine against R's spatstat and spdep on committed inputs. Expected figures were frozen by
// tests/fixtures/analysis/reference-r/make-expected.R (spatstat Kest and clarkevans; spdep moran.test and
// localG) from the *.input.json files beside it; the version of each library is in each expected file.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { distanceBandNeighbours, getisOrdGiStar, moransI } from '../../shared/analysis/autocorrelation.ts';
import { fieldAreaM2, fieldPerimeterM } from '../../shared/analysis/area.ts';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { labelledK, stopPairs } from '../../shared/analysis/labelling.ts';
import { meanNearestNeighbourDistance } from '../../shared/analysis/nearest-neighbour-index.ts';
import { clarkEvans, donnellyCorrected } from '../../shared/analysis/nearest-neighbour.ts';
import { ripleyK } from '../../shared/analysis/ripley.ts';
import { quadratGrid } from '../../shared/analysis/quadrat.ts';
import { stopsQuadratTest } from '../../shared/analysis/stops-quadrat.ts';

const dir = new URL('../fixtures/analysis/reference-r/', import.meta.url);
const read = (name: string) => JSON.parse(readFileSync(new URL(name, dir), 'utf8'));

const relativeGap = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

for (const name of ['irregular-zigzag', 'square-w']) {
  describe(`${name}: figures against spatstat and spdep`, () => {
    const input = read(`${name}.input.json`);
    const expected = read(`${name}.expected.json`);
    const field = createPlanarField([[input.ring]]);
    const m = input.x.length;
    const xy = new Float64Array(m * 2);
    for (let i = 0; i < m; i++) [xy[i * 2], xy[i * 2 + 1]] = [input.x[i], input.y[i]];
    const found = Uint8Array.from(input.found);
    const foundXY = new Float64Array(xy.filter((_, k) => found[k >> 1] === 1));
    const area = fieldAreaM2(field);

    it('has the same field area as spatstat', () => {
      expect(relativeGap(area, expected.areaM2)).toBeLessThan(1e-9);
    });

    it("gives spatstat's isotropic K for the found stops, all stops and their difference (Kest, correction = 'isotropic')", () => {
      const pairs = stopPairs(field, xy, input.radii, area, 'isotropic');
      const kFound = labelledK(pairs, found);
      const kAll = labelledK(pairs, new Uint8Array(m).fill(1));
      input.radii.forEach((_: number, k: number) => {
        expect(relativeGap(kFound[k], expected.kFound.isotropic[k])).toBeLessThan(1e-6);
        expect(relativeGap(kAll[k], expected.kAllStops.isotropic[k])).toBeLessThan(1e-6);
        expect(relativeGap(kFound[k] - kAll[k], expected.kDifferenceIsotropic[k])).toBeLessThan(1e-6);
      });
    });

    it("gives spatstat's isotropic K through ripleyK as well", () => {
      const K = ripleyK(field, foundXY, input.radii, area, 'isotropic');
      input.radii.forEach((_: number, k: number) => expect(relativeGap(K[k], expected.kFound.isotropic[k])).toBeLessThan(1e-6));
    });

    // spatstat's exact border engine serves rectangles; in a polygon it bins boundary distances on the r grid,
    // so the comparison is made in the square field only.
    if (name === 'square-w')
      it("gives spatstat's border K times n/(n − 1): spatstat estimates λ as n/A, the engine as (n − 1)/A", () => {
        const pairs = stopPairs(field, xy, input.radii, area, 'border');
        const kFound = labelledK(pairs, found);
        const n = expected.foundStops;
        input.radii.forEach((_: number, k: number) => expect(relativeGap(kFound[k], (expected.kFound.border[k] * n) / (n - 1))).toBeLessThan(1e-6));
      });

    it("gives spatstat's Clark–Evans R (clarkevans, no correction; Donnelly in a rectangle)", () => {
      const n = foundXY.length / 2;
      const mean = meanNearestNeighbourDistance(foundXY);
      expect(clarkEvans(mean, n, area).R).toBeCloseTo(expected.clarkEvans.naive, 9);
      if (typeof expected.clarkEvans.donnelly === 'number')
        expect(donnellyCorrected(mean, n, area, fieldPerimeterM(field)).R).toBeCloseTo(expected.clarkEvans.donnelly, 9);
    });

    it("gives spdep's Moran's I, its expectation and randomisation variance (moran.test, binary weights)", () => {
      const nb = distanceBandNeighbours(xy, input.band);
      const moran = moransI(input.counts, nb, 0);
      expect(moran.I).toBeCloseTo(expected.moran.I, 10);
      expect(moran.expected).toBeCloseTo(expected.moran.expected, 12);
      expect(moran.variance).toBeCloseTo(expected.moran.variance, 10);
    });

    it("gives R's chisq.test of equal proportions of found stops over the quadrat cells", () => {
      const grid = quadratGrid(field, m, area);
      expect(grid.cellWidth).toBeCloseTo(expected.equalProportions.cellSideM, 9);
      const result = stopsQuadratTest(grid, xy, found, [], { simulations: 0, seed: 1, cellCount: grid.cols * grid.rows });
      expect(result?.chiSquare).toBeCloseTo(expected.equalProportions.chiSquare, 9);
      expect(result?.df).toBe(expected.equalProportions.df);
    });

    it("gives spdep's Getis–Ord Gi* (localG with include.self, binary weights)", () => {
      const nb = distanceBandNeighbours(xy, input.band);
      const gi = getisOrdGiStar(input.counts, nb);
      expected.giStar.forEach((z: number, i: number) => expect(gi[i]).toBeCloseTo(z, 9));
    });
  });
}
