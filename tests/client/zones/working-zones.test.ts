// The zone editor's working zones: what the adviser sees measured and stores when accepting.
import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import {
  addDrawnZone,
  foundSightingPoints,
  nextZoneLabel,
  removeZone,
  reshapeZone,
  treatedAreaM2,
  zoneFigures,
  zonesForAcceptance,
  type WorkingZone,
} from '../../../src/features/zones/working-zones.ts';

// Area of a longitude/latitude rectangle on a sphere of radius R: A = R² · Δλ · (sin φ2 − sin φ1)
// (the spherical-zone formula; e.g. Snyder 1987, "Map Projections — A Working Manual", USGS PP 1395, on
// equal-area cylindrical projection). turf 7 measures on a sphere of the mean Earth radius R = 6 371 008.8 m
// (IUGG mean radius R1, Moritz 1980, "Geodetic Reference System 1980"), so the browser's figures should
// match this closed form with that R.
const R = 6_371_008.8;
const rad = (deg: number) => (deg * Math.PI) / 180;
const sphericalRectangleM2 = (west: number, south: number, east: number, north: number) =>
  R * R * rad(east - west) * (Math.sin(rad(north)) - Math.sin(rad(south)));

const rectangle = (west: number, south: number, east: number, north: number): Polygon => ({
  type: 'Polygon',
  coordinates: [
    [
      [west, south],
      [east, south],
      [east, north],
      [west, north],
      [west, south],
    ],
  ],
});

const zone = (key: string, label: string, geometry: Polygon, origin: WorkingZone['origin'] = 'drawn'): WorkingZone => ({ key, label, geometry, origin });

describe('a zone changed in the browser', () => {
  // A 0.01° × 0.01° square at the equator: about 1.112 km on a side, about 123.6 ha.
  const square = zone('a', 'Zone 1', rectangle(0, 0, 0.01, 0.01), 'edited');
  const squareM2 = sphericalRectangleM2(0, 0, 0.01, 0.01);

  it('is measured on the sphere', () => {
    expect(zoneFigures(square, 2 * squareM2, []).areaM2).toBeCloseTo(squareM2, -2);
    expect(zoneFigures(square, 2 * squareM2, []).areaM2 / squareM2).toBeCloseTo(1, 3);
  });

  it('states its share of the field: half of a field twice its size', () => {
    expect(zoneFigures(square, 2 * squareM2, []).shareOfField).toBeCloseTo(0.5, 3);
  });

  it('never claims more than the whole field', () => {
    expect(zoneFigures(square, squareM2 / 2, []).shareOfField).toBe(1);
  });

  it('counts the sightings inside it, not those outside', () => {
    const inside: [number, number] = [0.005, 0.005];
    const outside: [number, number] = [0.02, 0.005];
    expect(zoneFigures(square, squareM2, [inside, outside, inside]).sightingsInside).toBe(2);
  });

  it('says its figures are the browser’s, not the engine’s', () => {
    expect(zoneFigures(square, squareM2, []).fromEngine).toBe(false);
  });
});

describe('a zone as the engine proposed it', () => {
  it('keeps the engine’s figures while it is unchanged', () => {
    const proposed: WorkingZone = {
      ...zone('p', 'Zone 1', rectangle(0, 0, 0.01, 0.01), 'proposed'),
      proposed: { zone: 1, areaM2: 5000, shareOfField: 0.1, sightings: 7 } as WorkingZone['proposed'],
    };
    expect(zoneFigures(proposed, 50_000, [])).toEqual({ areaM2: 5000, shareOfField: 0.1, sightingsInside: 7, fromEngine: true });
  });

  it('loses them once reshaped on the map', () => {
    const proposed: WorkingZone = {
      ...zone('p', 'Zone 1', rectangle(0, 0, 0.01, 0.01), 'proposed'),
      proposed: { zone: 1, areaM2: 5000, shareOfField: 0.1, sightings: 7 } as WorkingZone['proposed'],
    };
    const [reshaped] = reshapeZone([proposed], 'p', rectangle(0, 0, 0.02, 0.01));
    expect(reshaped.origin).toBe('edited');
    expect(reshaped.proposed).toBeUndefined();
    expect(zoneFigures(reshaped, 1e9, []).fromEngine).toBe(false);
  });
});

describe('editing the list', () => {
  it('keeps a hand-drawn zone hand-drawn when reshaped', () => {
    const [reshaped] = reshapeZone([zone('d', 'Zone 1', rectangle(0, 0, 0.01, 0.01))], 'd', rectangle(0, 0, 0.02, 0.01));
    expect(reshaped.origin).toBe('drawn');
  });

  it('reshapes only the zone it was asked to', () => {
    const first = zone('a', 'Zone 1', rectangle(0, 0, 0.01, 0.01), 'edited');
    const second = zone('b', 'Zone 2', rectangle(1, 1, 1.01, 1.01), 'edited');
    const after = reshapeZone([first, second], 'b', rectangle(2, 2, 2.01, 2.01));
    expect(after[0]).toBe(first);
    expect(after[1].geometry).toEqual(rectangle(2, 2, 2.01, 2.01));
  });

  it('removes one zone by its key', () => {
    const after = removeZone([zone('a', 'Zone 1', rectangle(0, 0, 1, 1)), zone('b', 'Zone 2', rectangle(0, 0, 1, 1))], 'a');
    expect(after.map((z) => z.key)).toEqual(['b']);
  });

  it('labels a drawn zone with the next number not yet in the table', () => {
    // Zones "Zone 1" and "Zone 3" are on screen (Zone 2 was deleted): a third zone would be "Zone 3", which is
    // taken, so the new one is "Zone 4".
    const zones = [zone('a', 'Zone 1', rectangle(0, 0, 1, 1)), zone('c', 'Zone 3', rectangle(0, 0, 1, 1))];
    expect(nextZoneLabel(zones)).toBe('Zone 4');
    const after = addDrawnZone(zones, rectangle(5, 5, 6, 6));
    expect(after).toHaveLength(3);
    expect(after[2]).toMatchObject({ label: 'Zone 4', origin: 'drawn' });
    expect(new Set(after.map((z) => z.key)).size).toBe(3);
  });
});

describe('the treated area of several zones', () => {
  it('counts an overlap once', () => {
    // Two 0.01° × 0.01° squares overlapping by half: their union is a 0.015° × 0.01° rectangle.
    const a = zone('a', 'Zone 1', rectangle(0, 0, 0.01, 0.01));
    const b = zone('b', 'Zone 2', rectangle(0.005, 0, 0.015, 0.01));
    const figures = [a, b].map((z) => zoneFigures(z, 1e9, []));
    expect(treatedAreaM2([a, b], figures) / sphericalRectangleM2(0, 0, 0.015, 0.01)).toBeCloseTo(1, 3);
  });

  it('adds zones that do not touch', () => {
    const a = zone('a', 'Zone 1', rectangle(0, 0, 0.01, 0.01));
    const b = zone('b', 'Zone 2', rectangle(0.02, 0, 0.03, 0.01));
    const figures = [a, b].map((z) => zoneFigures(z, 1e9, []));
    expect(treatedAreaM2([a, b], figures) / (2 * sphericalRectangleM2(0, 0, 0.01, 0.01))).toBeCloseTo(1, 3);
  });

  it('is nothing with no zones', () => {
    expect(treatedAreaM2([], [])).toBe(0);
  });
});

describe('the zones sent for acceptance', () => {
  it('are an RFC 7946 FeatureCollection of Features carrying each zone’s label', () => {
    const geometry = rectangle(0, 0, 0.01, 0.01);
    const sent = zonesForAcceptance([zone('a', 'North headland', geometry)]);
    // RFC 7946 §3.3: a FeatureCollection has "type" and a "features" array; §3.2: each Feature has "type",
    // "geometry" and "properties".
    expect(sent.type).toBe('FeatureCollection');
    expect(sent.features).toEqual([{ type: 'Feature', properties: { label: 'North headland' }, geometry }]);
  });

  it('keep each ring closed, first position equal to the last (RFC 7946 §3.1.6)', () => {
    const ring = (zonesForAcceptance([zone('a', 'Zone 1', rectangle(0, 0, 0.01, 0.01))]).features[0].geometry as Polygon).coordinates[0];
    expect(ring[0]).toEqual(ring[ring.length - 1]);
  });
});

describe('the sightings the zones are measured against', () => {
  const sightings = [
    { id: 's1', count: 4, position: { lon: 10.5, lat: 52.25 } },
    { id: 's2', count: 0, position: { lon: 10.6, lat: 52.3 } },
    { id: 's3', count: null, position: { lon: 10.7, lat: 52.35 } },
    { id: 's4', count: 2, position: null },
    { id: 's5', count: 1, position: { lon: 10.8, lat: 52.4 } },
  ];

  it('are positions longitude first (RFC 7946 §3.1.1)', () => {
    expect(foundSightingPoints([sightings[0]], null)).toEqual([[10.5, 52.25]]);
  });

  it('leave out empty stops (count 0) and unplaced photos, and keep presence-only sightings', () => {
    expect(foundSightingPoints(sightings, null).map(([lon]) => lon)).toEqual([10.5, 10.7, 10.8]);
  });

  it('are only the check’s own sightings when the zones come from a check', () => {
    expect(foundSightingPoints(sightings, ['s1', 's2'])).toEqual([[10.5, 52.25]]);
  });
});
