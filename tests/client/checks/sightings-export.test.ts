// The review table's download: CSV by RFC 4180 and GeoJSON by RFC 7946, built in the browser.
import { describe, expect, it } from 'vitest';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { csvField, sightingsCsv, sightingsGeoJson } from '../../../src/features/checks/utils/sightings-export.ts';

const sighting = (change: Partial<SightingView>): SightingView => ({
  id: 's-1',
  fieldId: 'f-1',
  walkId: 'w-1',
  walkedOn: '2026-07-14',
  pestId: 'p-1',
  pestName: 'Soybean aphid',
  count: 12,
  position: { lon: -96.7, lat: 40.8 },
  positionSource: 'exif',
  accuracyM: 4,
  altitudeM: null,
  directionDeg: null,
  observedAt: '2026-07-14T15:02:00.000Z',
  timeFlag: null,
  status: 'placed',
  photoId: 'ph-1',
  thumbnailStatus: 'ready',
  scoutId: 'u-1',
  scoutName: 'Ada Field',
  isEmptyStop: false,
  createdAt: '2026-07-14T15:05:00.000Z',
  ...change,
});

describe('CSV fields (RFC 4180 §2)', () => {
  it('leave plain text unquoted', () => {
    expect(csvField('aphid')).toBe('aphid');
  });

  it('quote a field holding a comma (rule 6)', () => {
    expect(csvField('Smith, north')).toBe('"Smith, north"');
  });

  it('quote a field holding a line break (rule 6)', () => {
    expect(csvField('line one\nline two')).toBe('"line one\nline two"');
    expect(csvField('a\r\nb')).toBe('"a\r\nb"');
  });

  it('double a quote inside a quoted field (rule 7)', () => {
    expect(csvField('the "big" patch')).toBe('"the ""big"" patch"');
  });

  it('write a missing value as an empty field', () => {
    expect(csvField(null)).toBe('');
  });
});

describe('the CSV file', () => {
  it('has one header line and one record per sighting, each ended by CRLF (RFC 4180 §2.1–2.3)', () => {
    const csv = sightingsCsv([sighting({}), sighting({ id: 's-2' })]);
    expect(csv.endsWith('\r\n')).toBe(true);
    const lines = csv.slice(0, -2).split('\r\n');
    expect(lines).toHaveLength(3);
    expect(lines[0].split(',')).toContain('longitude');
  });

  it('keeps every record as wide as the header, even when a name holds a comma (RFC 4180 §2.4)', () => {
    const csv = sightingsCsv([sighting({ scoutName: 'Field, Ada' })]);
    const [header, record] = csv.slice(0, -2).split('\r\n');
    // Split on commas outside quotes: the quoted name counts as one field.
    const fieldsOf = (line: string) => line.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.filter((f, i, all) => i < all.length - 1 || f !== '');
    expect(fieldsOf(record)).toHaveLength(header.split(',').length);
  });
});

describe('the GeoJSON file (RFC 7946)', () => {
  it('is a FeatureCollection of Point Features, longitude first (§3.1.1, §3.1.2, §3.3)', () => {
    const collection = sightingsGeoJson([sighting({})]);
    expect(collection.type).toBe('FeatureCollection');
    expect(collection.features[0].type).toBe('Feature');
    expect(collection.features[0].geometry).toEqual({ type: 'Point', coordinates: [-96.7, 40.8] });
  });

  it('carries the sighting id as the Feature id (§3.2)', () => {
    expect(sightingsGeoJson([sighting({ id: 's-9' })]).features[0].id).toBe('s-9');
  });

  it('keeps the position only in the geometry, not again in the properties', () => {
    const properties = sightingsGeoJson([sighting({})]).features[0].properties!;
    expect(properties).not.toHaveProperty('longitude');
    expect(properties).not.toHaveProperty('latitude');
    expect(properties).toMatchObject({ pest: 'Soybean aphid', count: 12, scout: 'Ada Field' });
  });

  it('leaves out a photo that has no position yet', () => {
    expect(sightingsGeoJson([sighting({ position: null, status: 'needs-pin' })]).features).toHaveLength(0);
  });

  it('is valid JSON text that reads back the same (§2)', () => {
    const collection = sightingsGeoJson([sighting({})]);
    expect(JSON.parse(JSON.stringify(collection))).toEqual(collection);
  });
});
