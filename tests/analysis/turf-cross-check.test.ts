// Cross-check against turf's nearestNeighborAnalysis (a general-purpose reference library) on the same
// data: turf measures on the sphere, we in UTM, so figures agree within 0.5 %.
import { featureCollection, nearestNeighborAnalysis, point, polygon } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { analyse } from '../../shared/analysis/analyse.ts';
import { createRandom } from '../../shared/analysis/random.ts';

const LON0 = -96.7;
const LAT0 = 40.8;
const metresPerDegreeLat = 111_034;
const metresPerDegreeLon = 111_320 * Math.cos((LAT0 * Math.PI) / 180);
const lonLat = (x: number, y: number) => [LON0 + x / metresPerDegreeLon, LAT0 + y / metresPerDegreeLat];

type TurfFigures = { observedMeanDistance: number; expectedMeanDistance: number; nearestNeighborIndex: number; zScore: number };

function compare(points: number[][], ring: number[][]) {
  const boundary = polygon([ring]);
  const sightings = featureCollection(points.map((c) => point(c)));
  // turf's type omits nearestNeighborIndex, which its result does carry.
  const turf = nearestNeighborAnalysis(sightings, { studyArea: boundary, units: 'meters' }).properties.nearestNeighborAnalysis as unknown as TurfFigures;
  const ours = analyse(boundary, sightings, { simulations: 0, stopRadiusM: 0 }).nearestNeighbour;
  if (!ours) throw new Error('no nearest-neighbour result');
  return { turf, ours };
}

describe('nearest-neighbour test against turf', () => {
  it('agrees with turf within 0.5 % on random sightings in a field', () => {
    const random = createRandom(3);
    const ring = [lonLat(0, 0), lonLat(600, 0), lonLat(600, 400), lonLat(0, 400), lonLat(0, 0)];
    const points = Array.from({ length: 400 }, () => lonLat(random() * 600, random() * 400));
    const { turf, ours } = compare(points, ring);
    expect(Math.abs(ours.meanDistanceM / turf.observedMeanDistance - 1)).toBeLessThan(0.005);
    expect(Math.abs(ours.expectedDistanceM / turf.expectedMeanDistance - 1)).toBeLessThan(0.005);
    expect(Math.abs(ours.R / turf.nearestNeighborIndex - 1)).toBeLessThan(0.005);
    expect(Math.abs(ours.z - turf.zScore)).toBeLessThan(0.005 * Math.max(1, Math.abs(turf.zScore)));
  });

  it('gives R ≈ 2 for a square grid of sightings in both', () => {
    const spacing = 20;
    const k = 15;
    const points: number[][] = [];
    for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) points.push(lonLat((i + 0.5) * spacing, (j + 0.5) * spacing));
    const side = k * spacing;
    const ring = [lonLat(0, 0), lonLat(side, 0), lonLat(side, side), lonLat(0, side), lonLat(0, 0)];
    const { turf, ours } = compare(points, ring);
    expect(ours.R).toBeGreaterThan(1.99);
    expect(ours.R).toBeLessThan(2.01);
    expect(Math.abs(turf.nearestNeighborIndex - 2)).toBeLessThan(0.01);
  });
});
