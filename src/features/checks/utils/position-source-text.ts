import type { PositionSource } from '@shared/schemas/sightings.ts';

// The adviser's wording for where a position came from (the scout's screens word it for the phone).
const texts: Record<PositionSource, string> = {
  exif: 'Photo GPS (EXIF)',
  pin: 'Pinned by hand',
  device: 'Phone location',
};

export const positionSourceText = (source: PositionSource) => texts[source];
