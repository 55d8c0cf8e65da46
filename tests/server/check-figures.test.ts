// How a check's result is split for storage, and the sentences that refuse one too large to store.
import { describe, expect, it } from 'vitest';
import { analyse, type AnalysisResult } from '../../shared/analysis/analyse.ts';
import { MAX_FIGURES_BYTES, MAX_SCOUTED_AREA_CORNERS, oversizeMessage, scoutedAreaCorners, splitResult } from '../../server/services/check-figures.ts';

// Invented stops: a 10 × 8 grid over a field of about 420 m × 330 m, every third stop empty (a stops design).
const corner = { lon: -96.6, lat: 41.2 };
const size = { lon: 0.005, lat: 0.003 };
const boundary = {
  type: 'Polygon' as const,
  coordinates: [
    [
      [corner.lon, corner.lat],
      [corner.lon + size.lon, corner.lat],
      [corner.lon + size.lon, corner.lat + size.lat],
      [corner.lon, corner.lat + size.lat],
      [corner.lon, corner.lat],
    ],
  ],
};
const stops = Array.from({ length: 80 }, (_, k) => ({
  type: 'Feature' as const,
  geometry: {
    type: 'Point' as const,
    coordinates: [corner.lon + (((k % 10) + 0.5) / 10) * size.lon, corner.lat + ((Math.floor(k / 10) + 0.5) / 8) * size.lat],
  },
  properties: { id: `stop-${k}`, count: k % 3 === 0 ? 0 : 1 + (k % 5) },
}));
const result = analyse(boundary, { type: 'FeatureCollection', features: stops }, { simulations: 19, seed: 1 });

describe('splitting a check for storage', () => {
  it('keeps the scouted area out of the figures, in the columns, and counts the figures in UTF-8 bytes', () => {
    expect(result.scouted?.scouted.coordinates.length).toBeGreaterThan(0);
    const split = splitResult(result);
    const figures = JSON.parse(split.figuresJson);
    expect(figures.scouted).not.toHaveProperty('scouted');
    expect(figures.scouted).not.toHaveProperty('notScouted');
    expect(figures.scouted.scoutedM2).toBe(result.scouted!.scoutedM2);
    expect(JSON.parse(split.design.scouted!)).toEqual(result.scouted!.scouted);
    // Node's own count of the stored text's bytes.
    expect(split.figuresBytes).toBe(Buffer.byteLength(split.figuresJson, 'utf8'));
    expect(oversizeMessage(result, split.figuresBytes)).toBeNull();
  });
});

describe('a check too large to store', () => {
  it('is refused with a sentence giving the size, the bound and the part to change', () => {
    const giStar = result.counts!.giStar;
    // The per-stop figures repeated until the figures pass the bound.
    const copies = Math.ceil(MAX_FIGURES_BYTES / JSON.stringify(giStar).length) + 1;
    const large = { ...result, counts: { ...result.counts!, giStar: Array.from({ length: copies }, () => giStar).flat() } } as AnalysisResult;
    const { figuresBytes } = splitResult(large);
    expect(figuresBytes).toBeGreaterThan(MAX_FIGURES_BYTES);
    const message = oversizeMessage(large, figuresBytes);
    expect(message).toMatch(
      /^This check's figures would take \d+\.\d MB, over the 4\.0 MB a check may store; most of it is per-stop figures \(check fewer sightings/,
    );
    expect(Number(message!.match(/take (\d+\.\d) MB/)![1])).toBeCloseTo(figuresBytes / 2 ** 20, 1);
  });

  it('is refused when its scouted area has more corners than a check may store, though its figures fit', () => {
    const scouted = result.scouted!;
    const scoutedCorners = scouted.scouted.coordinates.flat().reduce((sum, ring) => sum + ring.length, 0);
    const copies = Math.ceil(MAX_SCOUTED_AREA_CORNERS / scoutedCorners) + 1;
    const many = { ...scouted.scouted, coordinates: Array.from({ length: copies }, () => scouted.scouted.coordinates).flat() };
    const large = { ...result, scouted: { ...scouted, scouted: many } } as AnalysisResult;
    expect(scoutedAreaCorners(large)).toBeGreaterThan(MAX_SCOUTED_AREA_CORNERS);
    const { figuresBytes } = splitResult(large);
    expect(figuresBytes).toBeLessThan(MAX_FIGURES_BYTES);
    expect(oversizeMessage(large, figuresBytes)).toMatch(
      /^This check's scouted area would have [\d,]+ corners, over the 1,000,000 a check may store; check fewer stops, for example a shorter date window\.$/,
    );
  });
});
