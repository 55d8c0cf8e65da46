// The stops design: a sighting exists only where a scout stopped, so the stops are the reference.
// Expected rates come from the theory of Monte Carlo tests (Besag & Diggle 1977: under random labelling the
// relabellings and the observation are exchangeable, so P(p ≤ α) ≤ α) and binomial sampling error, never
// from the engine's own output.
import { describe, expect, it } from 'vitest';
import { analyse } from '../../shared/analysis/analyse.ts';
import { relabelWithinWalks } from '../../shared/analysis/labelling.ts';
import { mergeStops } from '../../shared/analysis/stops.ts';
import { mulberry32, patchLabels, randomLabels, squareField, stopsCollection, wWalk } from './walks.ts';

/** Largest count of "Clustered" out of `runs` that a true rate of 5 % reaches with probability under 1 % (binomial upper tail). */
function binomialCeiling(runs: number, rate: number, tail = 0.01): number {
  let k = 0;
  let cumulative = 0;
  let term = (1 - rate) ** runs;
  while (k < runs) {
    cumulative += term;
    if (1 - cumulative < tail) return k;
    term *= ((runs - k) / (k + 1)) * (rate / (1 - rate));
    k++;
  }
  return runs;
}

describe('a W walk with the pest at random stops', () => {
  it('reads as Clustered no more often than the nominal 5 % (beyond binomial sampling error)', () => {
    const walk = wWalk();
    const runs = 100;
    let clustered = 0;
    for (let s = 0; s < runs; s++) {
      const labels = randomLabels(walk.length, 0.3, mulberry32(7000 + s));
      const result = analyse(squareField, stopsCollection(walk, labels), { planar: true, seed: s, simulations: 199 });
      expect(result.design).toBe('stops');
      if (result.spread.verdict === 'clustered') clustered++;
    }
    expect(clustered).toBeLessThanOrEqual(binomialCeiling(runs, 0.05));
  });

  it('still finds one real patch holding 10 % of the stops in at least 80 % of walks', () => {
    const walk = wWalk();
    const runs = 30;
    let clustered = 0;
    for (let s = 0; s < runs; s++) {
      const labels = patchLabels(walk, mulberry32(9000 + s));
      if (analyse(squareField, stopsCollection(walk, labels), { planar: true, seed: s, simulations: 199 }).spread.verdict === 'clustered') clustered++;
    }
    expect(clustered / runs).toBeGreaterThanOrEqual(0.8);
  });

  it('states the design, the primary test first and marks everything else as supporting', () => {
    const walk = wWalk();
    const labels = patchLabels(walk, mulberry32(4));
    const result = analyse(squareField, stopsCollection(walk, labels), { planar: true, simulations: 199 });
    expect(result.spread.design).toBe('stops');
    expect(result.spread.decidedBy).toBe('random-labelling');
    expect(result.spread.evidence[0].role).toBe('primary');
    expect(result.spread.evidence.slice(1).every((e) => e.role === 'supporting')).toBe(true);
    expect(result.randomLabelling?.envelope.alpha).toBe(0.05);
  });
});

describe('repeated photos of one spot', () => {
  function twicePhotographed(seed: number) {
    const random = mulberry32(seed);
    const features = [];
    for (let k = 0; k < 25; k++) {
      const x = 999 * random();
      const y = 1000 * random();
      for (const dx of [0, 1])
        features.push({ type: 'Feature' as const, properties: { id: `p${k}-${dx}` }, geometry: { type: 'Point' as const, coordinates: [x + dx, y] } });
    }
    return { type: 'FeatureCollection' as const, features };
  }

  it('merges the two photos of each spot into one stop and lists each merge', () => {
    const result = analyse(squareField, twicePhotographed(1), { planar: true, simulations: 99 });
    expect(result.stops.count).toBe(25);
    expect(result.stops.merges).toHaveLength(25);
    expect(result.stops.merges[0].sightingIds).toHaveLength(2);
    expect(result.design).toBe('whole-field');
  });

  it('does not read 25 random spots photographed twice as Clustered', () => {
    let clustered = 0;
    for (let s = 0; s < 20; s++)
      if (analyse(squareField, twicePhotographed(100 + s), { planar: true, seed: s, simulations: 199 }).spread.verdict === 'clustered') clustered++;
    expect(clustered).toBeLessThanOrEqual(binomialCeiling(20, 0.05));
  });
});

describe('same-stop merging', () => {
  const sighting = (id: string, x: number, walk: string, count: number | null, accuracyM: number | null = null) => ({ id, x, y: 0, walk, count, accuracyM });

  it('sums the counts of three photos of one plant within 5 m', () => {
    const merged = mergeStops([sighting('a', 0, 'w', 2), sighting('b', 1, 'w', 3), sighting('c', 2, 'w', 0)]);
    expect(merged.stops).toHaveLength(1);
    expect(merged.stops[0].count).toBe(5);
    expect(merged.merges[0].sightingIds).toEqual(['a', 'b', 'c']);
  });

  it('does not chain photos of a row 4 m apart into one long stop', () => {
    const row = Array.from({ length: 10 }, (_, k) => sighting(`r${k}`, 4 * k, 'w', 1));
    const merged = mergeStops(row);
    expect(merged.stops.length).toBeGreaterThanOrEqual(4);
    for (const merge of merged.merges) expect(merge.spanM).toBeLessThan(10);
  });

  it('keeps sightings of different walks apart even at the same spot', () => {
    expect(mergeStops([sighting('a', 0, 'w1', 2), sighting('b', 1, 'w2', 3)]).stops).toHaveLength(2);
  });

  it('turns merging off with a radius of 0', () => {
    expect(mergeStops([sighting('a', 0, 'w', 2), sighting('b', 1, 'w', 3)], 0).stops).toHaveLength(2);
  });

  it('widens the radius to the stated GPS accuracy', () => {
    expect(mergeStops([sighting('a', 0, 'w', 2), sighting('b', 8, 'w', 3)]).stops).toHaveLength(2);
    expect(mergeStops([sighting('a', 0, 'w', 2, 10), sighting('b', 8, 'w', 3)]).stops).toHaveLength(1);
  });

  it('keeps an empty stop empty and a found photo beside it found', () => {
    const merged = mergeStops([sighting('a', 0, 'w', 0), sighting('b', 1, 'w', null)]);
    expect(merged.stops[0].found).toBe(true);
  });
});

describe('permutations stratified by walk', () => {
  it('keeps each walk’s number of found stops in every relabelling', () => {
    const labels = Uint8Array.from([1, 1, 1, 0, 0, 0, 0, 1, 0, 0]);
    const walks = [Int32Array.from([0, 1, 2, 3, 4]), Int32Array.from([5, 6, 7, 8, 9])];
    const out = new Uint8Array(10);
    const random = mulberry32(3);
    for (let t = 0; t < 50; t++) {
      relabelWithinWalks(labels, walks, random, out);
      expect(out[0] + out[1] + out[2] + out[3] + out[4]).toBe(3);
      expect(out[5] + out[6] + out[7] + out[8] + out[9]).toBe(1);
    }
  });
});

describe('boundary parts', () => {
  it('refuses a MultiPolygon whose parts overlap, with a sentence naming them', () => {
    const boundary = {
      type: 'MultiPolygon' as const,
      coordinates: [
        [
          [
            [0, 0],
            [600, 0],
            [600, 600],
            [0, 600],
            [0, 0],
          ],
        ],
        [
          [
            [500, 500],
            [1000, 500],
            [1000, 1000],
            [500, 1000],
            [500, 500],
          ],
        ],
      ],
    };
    expect(() => analyse(boundary, stopsCollection(wWalk(20), new Array(20).fill(true)), { planar: true })).toThrow(
      /Parts 1 and 2 of the boundary overlap \(10000 m²\)/,
    );
  });

  it('keeps a photo taken a metre outside the boundary at the headland, and says so', () => {
    const walk = wWalk();
    const sightings = stopsCollection(
      walk,
      walk.map((_, i) => i % 3 === 0),
    );
    sightings.features.push({ type: 'Feature', properties: { id: 'headland', count: 1, walk: 'w1' }, geometry: { type: 'Point', coordinates: [1001, 500] } });
    const result = analyse(squareField, sightings, { planar: true, simulations: 19 });
    expect(result.excluded.count).toBe(0);
    expect(result.stops.movedInside.ids).toEqual(['headland']);
  });
});

describe('verdict rules', () => {
  it('calls a field where most stops hold the pest Everywhere, not a patch', () => {
    const walk = wWalk();
    const labels = randomLabels(walk.length, 0.8, mulberry32(5));
    const result = analyse(squareField, stopsCollection(walk, labels), { planar: true, simulations: 99 });
    expect(result.spread.verdict).toBe('everywhere');
    expect(result.zones.features).toHaveLength(0);
  });

  it('shows no evidence beneath "Too few" that could read as a pattern', () => {
    const walk = wWalk();
    const labels = walk.map((_, i) => i < 6);
    const result = analyse(squareField, stopsCollection(walk, labels), { planar: true, simulations: 99 });
    expect(result.spread.verdict).toBe('too-few');
    expect(result.spread.evidence).toHaveLength(1);
    expect(result.spread.reasons.join(' ')).not.toMatch(/cluster|bunch|envelope|Moran/i);
  });

  it("says Can't tell: search uneven for photos only from one corner of the field", () => {
    const random = mulberry32(11);
    const features = Array.from({ length: 30 }, (_, i) => ({
      type: 'Feature' as const,
      properties: { id: `p${i}` },
      geometry: { type: 'Point' as const, coordinates: [20 + 300 * random(), 20 + 300 * random()] },
    }));
    const result = analyse(squareField, { type: 'FeatureCollection', features }, { planar: true, simulations: 99 });
    expect(result.design).toBe('whole-field');
    expect(result.spread.verdict).toBe('cant-tell');
    expect(result.spread.headline).toMatch(/search uneven/);
    expect(result.zones.features).toHaveLength(0);
  });
});
