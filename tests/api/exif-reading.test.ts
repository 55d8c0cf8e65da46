// Reading EXIF keeps no memory per photo: exifr builds an Options object for each options object it is handed
// and keeps it in a Map for the life of the process (exifr 7, src/options.mjs, Options.useCached), so the
// server must hand it the same options object on every read or a long-running server grows with every upload.
import { afterEach, describe, expect, it, vi } from 'vitest';
import exifr from 'exifr';
import { readPhotoExif } from '../../server/services/exif-reading.ts';
import { makeJpeg } from '../helpers/photos.ts';

// exifr's type declarations leave out the Options class its bundle exports.
const exifrOptions = (exifr as unknown as { Options: { useCached(options: unknown): unknown } }).Options;

afterEach(() => vi.restoreAllMocks());

describe('reading the EXIF of many photos', () => {
  it('leaves exifr with one cached set of options however many photos are read', async () => {
    const positions = [
      { lon: -98.41, lat: 41.103 },
      { lon: -98.405, lat: 41.104 },
      { lon: -98.4, lat: 41.105 },
    ];
    const photos = await Promise.all(positions.map((gps, i) => makeJpeg({ gps, markSeed: 70 + i, width: 64, height: 48 })));
    const useCached = vi.spyOn(exifrOptions, 'useCached');

    const readings = [];
    for (const photo of photos) readings.push(await readPhotoExif(photo));

    expect(useCached).toHaveBeenCalledTimes(photos.length);
    expect(new Set(useCached.mock.calls.map(([options]) => options)).size).toBe(1);
    // The shared options still read each photo's own GPS position (EXIF 2.32 GPS IFD, written by piexifjs).
    readings.forEach((reading, i) => {
      expect(reading.position?.lon).toBeCloseTo(positions[i].lon, 6);
      expect(reading.position?.lat).toBeCloseTo(positions[i].lat, 6);
    });
  });
});
