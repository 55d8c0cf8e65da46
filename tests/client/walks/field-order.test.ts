// The scout's field list: the field the phone stands in first, then by distance, past seasons apart.
import { describe, expect, it } from 'vitest';
import type { MultiPolygon } from 'geojson';
import type { FieldAnswer } from '@shared/schemas/fields.ts';
import { orderFieldsForScout } from '../../../src/features/walks/field-order.ts';

// Squares 0.01° on a side along the equator, where 0.01° of longitude is 1113.2 m (WGS 84 ellipsoid, equatorial
// circumference 40 075.017 km / 36 000); turf's haversine uses the mean radius 6 371 008.8 m, giving 1111.95 m.
const square = (west: number): MultiPolygon => ({
  type: 'MultiPolygon',
  coordinates: [
    [
      [
        [west, 0],
        [west + 0.01, 0],
        [west + 0.01, 0.01],
        [west, 0.01],
        [west, 0],
      ],
    ],
  ],
});
const field = (name: string, west: number, season = 2026): FieldAnswer => ({
  id: name,
  farmId: 'f',
  farmName: 'Farm',
  name,
  crop: 'Soybean',
  season,
  areaM2: 1,
  boundary: square(west),
});

describe('the scout’s field list', () => {
  const fields = [field('Far', 0.1), field('Near', 0.02), field('Here', 0), field('Old', 0.005, 2024)];

  it('puts the field the phone stands in first and names it', () => {
    const order = orderFieldsForScout(fields, { lon: 0.005, lat: 0.005 }, 2026);
    expect(order.here?.name).toBe('Here');
    expect(order.current.map((p) => p.field.name)).toEqual(['Here', 'Near', 'Far']);
  });

  it('measures the distance to the nearest edge of a field outside (haversine, mean Earth radius)', () => {
    const order = orderFieldsForScout(fields, { lon: 0.005, lat: 0.005 }, 2026);
    // From 0.005° E to Near's west edge at 0.02° E: 0.015° of longitude on the equator, 0.015 × 111 195 m = 1668 m.
    expect(order.current[1].distanceM).toBeCloseTo(1668, -1);
    expect(order.current[0].distanceM).toBe(0);
  });

  it('sets past seasons aside, even one the phone stands in', () => {
    const order = orderFieldsForScout(fields, { lon: 0.0075, lat: 0.005 }, 2026);
    expect(order.past.map((p) => p.field.name)).toEqual(['Old']);
    expect(order.current.map((p) => p.field.name)).not.toContain('Old');
  });

  it('falls back to names in order without a position, and says no field is here', () => {
    const order = orderFieldsForScout(fields, null, 2026);
    expect(order.current.map((p) => p.field.name)).toEqual(['Far', 'Here', 'Near']);
    expect(order.here).toBeNull();
  });
});
