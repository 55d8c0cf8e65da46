// A treatment zone sends a sprayer somewhere: every proposed zone must hold a place where the scout found the pest,
// whatever the smoothing or the margin do between stops, and it says which threshold it was held against. Checked
// over several invented patchy walks, with turf deciding which photos lie inside each zone.
import { booleanPointInPolygon } from '@turf/turf';
import { describe, expect, it } from 'vitest';
import { analyse } from '../../shared/analysis/analyse.ts';
import { rectangleBoundary } from '../helpers/sightings.ts';
import { patchyStops } from '../helpers/zones.ts';

function walkOf(seed: number) {
  const points = patchyStops(seed);
  const half = Math.floor(points.length / 2);
  return {
    type: 'FeatureCollection' as const,
    features: points.map((p, i) => ({
      type: 'Feature' as const,
      properties: { id: `s${i}`, count: p.count, walkId: i < half ? 'first' : 'second' },
      geometry: { type: 'Point' as const, coordinates: [p.lon, p.lat] },
    })),
  };
}

describe('zones from abundance among the stops', () => {
  it.each([11, 31, 32, 33])('each hold a photo of the pest and name the threshold (walk %i)', (seed) => {
    const sightings = walkOf(seed);
    const result = analyse(rectangleBoundary(), sightings, { simulations: 99, seed: 5, zones: { actionThreshold: 5 } });
    expect(result.zones.features.length).toBeGreaterThan(0);
    for (const zone of result.zones.features) {
      const foundInside = sightings.features.filter((f) => (f.properties.count ?? 0) > 0 && booleanPointInPolygon(f.geometry.coordinates, zone.geometry));
      expect(foundInside.length).toBeGreaterThan(0);
      expect(zone.properties.threshold).toBe(5);
      expect(zone.properties.basis).toBe('mean-count');
    }
  });
});
