import { area as turfArea, polygon } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { analyse, analysisOptionsSchema } from '../../shared/analysis/analyse.ts';
import { ENGINE_VERSION } from '../../shared/analysis/version.ts';
import { createRandom, normalDeviate } from '../../shared/analysis/random.ts';

const LON0 = -96.7;
const LAT0 = 40.8;
const perLon = 1 / (111_320 * Math.cos((LAT0 * Math.PI) / 180));
const perLat = 1 / 111_034;
const lonLat = (x: number, y: number) => [LON0 + x * perLon, LAT0 + y * perLat];
const BOUNDARY = polygon([[lonLat(0, 0), lonLat(700, 0), lonLat(700, 300), lonLat(450, 500), lonLat(0, 500), lonLat(0, 0)]]);

function sightings(points: Array<[number, number, number | null]>) {
  return {
    type: 'FeatureCollection' as const,
    features: points.map(([x, y, count], i) => ({
      type: 'Feature' as const,
      properties: { id: `s${i + 1}`, count },
      geometry: { type: 'Point' as const, coordinates: lonLat(x, y) },
    })),
  };
}

describe('analyse()', () => {
  const random = createRandom('analyse');
  const points: Array<[number, number, number | null]> = [];
  for (let i = 0; i < 30; i++) points.push([random() * 700, random() * 300, 1]);
  for (let i = 0; i < 50; i++) points.push([200 + 15 * normalDeviate(random), 150 + 15 * normalDeviate(random), 20]);
  for (let i = 0; i < 100; i++) points.push([random() * 700, random() * 300, 0]);
  points.push([-300, -300, 4]);
  // Merging off, so every generated point stays one stop and the counts below are the input's own.
  const result = analyse(BOUNDARY, sightings(points), { simulations: 99, stopRadiusM: 0 });

  it('reports the projection, the boundary area (within 0.5 % of turf.area on the sphere) and the excluded sightings', () => {
    expect(result.crs).toBe('EPSG:32614');
    expect(Math.abs(result.area.boundaryM2 / turfArea(BOUNDARY) - 1)).toBeLessThan(0.005);
    expect(result.excluded).toEqual({ count: 1, ids: ['s181'] });
    expect(result.emptyStops).toBe(100);
    expect(result.design).toBe('stops');
    expect(result.n).toBe(80);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
  });

  it('finds a patchy pest clustered, cites its figures and proposes a zone over the patch', () => {
    expect(result.spread.verdict).toBe('clustered');
    expect(result.spread.reasons[0]).toContain('K_found − K_all stops');
    expect(result.spread.reasons[0]).toContain(`${result.randomLabelling?.simulations} relabellings`);
    expect(result.zones.features.length).toBeGreaterThan(0);
    const zone = result.zones.features[0].properties;
    expect(zone.areaHa).toBeCloseTo(zone.areaM2 / 10_000, 12);
    expect(zone.areaAc).toBeCloseTo(zone.areaM2 / 4046.8564224, 12);
    expect(zone.sightings).toBeGreaterThan(25);
    expect(result.counts?.moran.expected).toBeCloseTo(-1 / (180 - 1), 12);
    expect(result.counts?.hotPatches.length).toBeGreaterThan(0);
  });

  it('returns plain JSON: nothing is lost through JSON.stringify', () => {
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });

  it('says "too few sightings" under the minimum, showing the minimum', () => {
    const few = analyse(BOUNDARY, sightings(points.slice(0, 6)), { simulations: 19 });
    expect(few.spread.verdict).toBe('too-few');
    expect(few.spread.minSightings).toBe(analysisOptionsSchema.parse({}).minSightings);
    expect(few.spread.reasons[0]).toContain('at least 10');
  });

  it('repeats every figure exactly for the same seed', () => {
    const again = analyse(BOUNDARY, sightings(points), { simulations: 99, stopRadiusM: 0 });
    expect({ ...again, timingsMs: {} }).toEqual({ ...result, timingsMs: {} });
  });
});
