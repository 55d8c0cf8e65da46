// Each zone held against the pest's action threshold: the stops inside it (empty stops included as 0), their mean
// count or share infested, and the stored zones shown as the server keeps them.
import { describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { mean } from 'simple-statistics';
import { countedStops, reshapeZone, zoneFigures, zonesFromStored, zoneStanding, type CountedStop } from '../../../src/features/zones/working-zones.ts';

const square: Polygon = {
  type: 'Polygon',
  coordinates: [
    [
      [-96.6, 41.2],
      [-96.599, 41.2],
      [-96.599, 41.201],
      [-96.6, 41.201],
      [-96.6, 41.2],
    ],
  ],
};
// Invented stops: four inside the square (one empty), one well outside it.
const stops: CountedStop[] = [
  [-96.5998, 41.2002, 6],
  [-96.5995, 41.2005, 0],
  [-96.5992, 41.2008, 9],
  [-96.5991, 41.2001, 3],
  [-96.59, 41.21, 40],
];

describe('zone standing against the threshold', () => {
  it('averages the counts of the stops inside, empty stops as 0, and leaves outside stops out', () => {
    const standing = zoneStanding({ geometry: square }, stops, { actionThreshold: 5, thresholdBasis: 'mean' });
    expect(standing.stops).toBe(4);
    expect(standing.value).toBeCloseTo(mean([6, 0, 9, 3]), 12);
    expect(standing.standing).toBe('below');
  });

  it('counts reaching the threshold as at or above, since zones are drawn where the mean reaches it', () => {
    expect(zoneStanding({ geometry: square }, stops, { actionThreshold: 4.5, thresholdBasis: 'mean' }).standing).toBe('at-or-above');
  });

  it('gives the share of stops infested for an incidence threshold', () => {
    const standing = zoneStanding({ geometry: square }, stops, { actionThreshold: 0.8, thresholdBasis: 'incidence' });
    expect(standing.value).toBe(3 / 4);
    expect(standing.standing).toBe('below');
  });

  it('says so when no counted stop lies inside', () => {
    expect(zoneStanding({ geometry: square }, [[-96.59, 41.21, 4]], { actionThreshold: 1, thresholdBasis: 'mean' })).toEqual({
      value: null,
      stops: 0,
      standing: 'no-stops',
    });
  });

  it('keeps empty stops and drops sightings without a count or outside the check', () => {
    const sightings = [
      { id: 'a', count: 0, position: { lon: 1, lat: 2 } },
      { id: 'b', count: null, position: { lon: 1, lat: 2 } },
      { id: 'c', count: 4, position: { lon: 3, lat: 4 } },
      { id: 'd', count: 2, position: { lon: 5, lat: 6 } },
    ];
    expect(countedStops(sightings, ['a', 'b', 'c'])).toEqual([
      [1, 2, 0],
      [3, 4, 4],
    ]);
  });
});

describe('stored zones', () => {
  const stored = {
    id: 'z1',
    label: 'North patch',
    areaM2: 8123.4,
    areaHa: 0.81234,
    areaAc: 2.0073,
    shareOfField: 0.042,
    sightingsInside: 7,
    geometry: { type: 'MultiPolygon' as const, coordinates: [square.coordinates] },
  };

  it('shows the server’s own figures while a zone is as stored', () => {
    const [zone] = zonesFromStored({ zones: [stored] });
    expect(zone).toMatchObject({ label: 'North patch', origin: 'stored' });
    expect(zoneFigures(zone, 200_000, [])).toEqual({ areaM2: 8123.4, shareOfField: 0.042, sightingsInside: 7, fromEngine: true });
  });

  it('measures a stored zone again in the browser once it is reshaped', () => {
    const [zone] = zonesFromStored({ zones: [stored] });
    const [edited] = reshapeZone([zone], zone.key, square);
    expect(edited.origin).toBe('edited');
    expect(zoneFigures(edited, 200_000, []).fromEngine).toBe(false);
  });
});
