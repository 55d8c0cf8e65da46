// The length of a walk's route: the stops joined in the order they were made, measured on the sphere by turf's
// `length` (great-circle distance, turf's mean Earth radius of 6 371 008.8 m).
import { length, lineString } from '@turf/turf';
import { withUnit } from './unit-symbols.ts';

export interface RoutePoint {
  lon: number;
  lat: number;
}

/** Metres walked from stop to stop, in the order given; 0 for fewer than two stops. */
export function routeLengthM(stops: RoutePoint[]): number {
  if (stops.length < 2) return 0;
  return length(lineString(stops.map((s) => [s.lon, s.lat])), { units: 'meters' });
}

/** "640 m" under a kilometre, "1.25 km" from there on. */
export function formatRouteLength(metres: number): string {
  return metres < 1000 ? withUnit(String(Math.round(metres)), 'metre') : withUnit((metres / 1000).toFixed(2), 'kilometre');
}
