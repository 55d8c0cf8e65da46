// The order an adviser reads each stop's Gi* figures in, and how merged photos are told.
import { describe, expect, it } from 'vitest';
import type { CheckStopsResponse } from '../../../shared/schemas/checks.ts';
import { stopReading, stopsInReadingOrder } from '../../../src/features/checks/utils/stop-readings.ts';

const stop = (id: string, z: number, hot = false, cold = false) => ({ id, count: 1, z, pValue: 0.5, qValue: 0.5, hot, cold });

describe('stopsInReadingOrder', () => {
  const response: CheckStopsResponse = {
    giStar: [stop('a', 0.2), stop('b', -3.1, false, true), stop('c', 2.5, true), stop('d', 3.4, true), stop('e', -0.9)],
    merges: [{ stop: 'c', sightingIds: ['c', 'c2', 'c3'], count: 4, walk: 'w', spanM: 2 }],
  };

  it('puts hot stops first, then cold ones, then the rest, the most marked z first within each', () => {
    expect(stopsInReadingOrder(response).map((s) => s.id)).toEqual(['d', 'c', 'b', 'e', 'a']);
  });

  it('counts the photos a merged stop stands for, and one for every other stop', () => {
    const photos = Object.fromEntries(stopsInReadingOrder(response).map((s) => [s.id, s.mergedPhotos]));
    expect(photos).toEqual({ a: 1, b: 1, c: 3, d: 1, e: 1 });
  });

  it('reads a stop as hot, cold or neither from its flags', () => {
    expect([stopReading({ hot: true, cold: false }), stopReading({ hot: false, cold: true }), stopReading({ hot: false, cold: false })]).toEqual([
      'hot',
      'cold',
      'neither',
    ]);
  });
});
