// Each stop's Gi* figures in reading order: the stops whose neighbourhood counts stand out come first.
import type { CheckStopsResponse } from '@shared/schemas/checks.ts';

export type StopFigure = CheckStopsResponse['giStar'][number] & { mergedPhotos: number };

export type StopReading = 'hot' | 'cold' | 'neither';

export const stopReading = (s: { hot: boolean; cold: boolean }): StopReading => (s.hot ? 'hot' : s.cold ? 'cold' : 'neither');

const readingOrder: Record<StopReading, number> = { hot: 0, cold: 1, neither: 2 };

/** Hot stops first, then cold, then the rest; within each, the most extreme z first. */
export function stopsInReadingOrder({ giStar, merges }: CheckStopsResponse): StopFigure[] {
  const photos = new Map(merges.map((m) => [m.stop, m.sightingIds.length]));
  return giStar
    .map((s) => ({ ...s, mergedPhotos: photos.get(s.id) ?? 1 }))
    .sort((a, b) => readingOrder[stopReading(a)] - readingOrder[stopReading(b)] || Math.abs(b.z) - Math.abs(a.z) || a.id.localeCompare(b.id));
}
