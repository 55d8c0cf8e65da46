// A zone's location in words, the same in the e-mail, the notice page and the print: decimal degrees (what a GPS
// takes, ASCII minus so they paste), whole metres and an eight-point compass direction from the nearest field corner.
import type { ZoneLocation } from '../schemas/notices.ts';

export const latLonText = (p: { lat: number; lon: number }) => `${p.lat.toFixed(5)}, ${p.lon.toFixed(5)}`;

export const fromCornerText = (l: ZoneLocation) => `${Math.round(l.distanceM)} m ${l.direction} of the field corner at ${latLonText(l.nearestCorner)}`;
