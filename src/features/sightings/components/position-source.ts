import type { PositionSource, SightingView } from '@shared/schemas/sightings.ts';

const labels: Record<PositionSource, string> = {
  exif: 'from photo GPS',
  pin: 'pinned by hand',
  device: 'phone location',
};

/** Where a sighting's position came from, in the scout's words. */
export function positionSourceLabel(sighting: Pick<SightingView, 'status' | 'positionSource'>) {
  return sighting.status === 'needs-pin' ? 'needs a pin' : labels[sighting.positionSource];
}
