import { describe, expect, it } from 'vitest';
import { utmProjectionFor, utmZone } from '../../shared/analysis/projection.ts';

describe('projection to UTM', () => {
  it('picks the UTM zone of the centroid and names its EPSG code (EPSG 326xx north, 327xx south)', () => {
    expect(utmZone(-96.7)).toBe(14);
    expect(utmProjectionFor(-96.7, 40.8).crs).toBe('EPSG:32614');
    expect(utmProjectionFor(151.2, -33.9).crs).toBe('EPSG:32756');
    expect(utmProjectionFor(-179.9, 10).crs).toBe('EPSG:32601');
  });

  it('puts the central meridian on the equator at easting 500,000 m, northing 0 (UTM definition)', () => {
    const [x, y] = utmProjectionFor(-93, 0.0001).forward(-93, 0);
    expect(x).toBeCloseTo(500_000, 6);
    expect(y).toBeCloseTo(0, 6);
    const [xs, ys] = utmProjectionFor(-93, -1).forward(-93, 0);
    expect(xs).toBeCloseTo(500_000, 6);
    expect(ys).toBeCloseTo(10_000_000, 6);
  });

  it('round-trips a field corner to within a millimetre', () => {
    const projection = utmProjectionFor(-96.7, 40.8);
    const [x, y] = projection.forward(-96.71, 40.81);
    const [lon, lat] = projection.inverse(x, y);
    expect(Math.abs(lon + 96.71) * 111_320 * Math.cos((40.81 * Math.PI) / 180)).toBeLessThan(0.001);
    expect(Math.abs(lat - 40.81) * 111_000).toBeLessThan(0.001);
  });
});
