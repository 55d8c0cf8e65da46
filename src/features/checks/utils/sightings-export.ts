// The review table's filtered sightings as CSV (RFC 4180) and GeoJSON (RFC 7946), downloaded in the browser.
// CSV quoting is hand-written: no CSV package is installed, and RFC 4180's rule fits in one function.
import type { Feature, FeatureCollection, Point } from 'geojson';
import type { SightingView } from '@shared/schemas/sightings.ts';

const columns: Array<{ header: string; value: (s: SightingView) => string | number | boolean | null }> = [
  { header: 'sighting_id', value: (s) => s.id },
  { header: 'walk_id', value: (s) => s.walkId },
  { header: 'walked_on', value: (s) => s.walkedOn },
  { header: 'observed_at', value: (s) => s.observedAt },
  { header: 'pest', value: (s) => s.pestName },
  { header: 'count', value: (s) => s.count },
  { header: 'empty_stop', value: (s) => s.isEmptyStop },
  { header: 'scout', value: (s) => s.scoutName },
  { header: 'longitude', value: (s) => s.position?.lon ?? null },
  { header: 'latitude', value: (s) => s.position?.lat ?? null },
  { header: 'position_source', value: (s) => s.positionSource },
  { header: 'accuracy_m', value: (s) => s.accuracyM },
  { header: 'photo_id', value: (s) => s.photoId },
];

/** RFC 4180 §2: a field holding a comma, a double quote or a line break is quoted, inner quotes doubled. */
export function csvField(value: string | number | boolean | null): string {
  if (value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Header line plus one record per sighting, CRLF line ends (RFC 4180 §2.1). */
export function sightingsCsv(sightings: SightingView[]): string {
  const lines = [columns.map((c) => csvField(c.header)).join(',')];
  for (const s of sightings) lines.push(columns.map((c) => csvField(c.value(s))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}

/** A FeatureCollection of points, longitude first (RFC 7946 §3.1.1); unplaced sightings are left out. */
export function sightingsGeoJson(sightings: SightingView[]): FeatureCollection<Point> {
  const features: Feature<Point>[] = [];
  for (const s of sightings) {
    if (!s.position) continue;
    features.push({
      type: 'Feature',
      id: s.id,
      geometry: { type: 'Point', coordinates: [s.position.lon, s.position.lat] },
      properties: Object.fromEntries(columns.filter((c) => c.header !== 'longitude' && c.header !== 'latitude').map((c) => [c.header, c.value(s)])),
    });
  }
  return { type: 'FeatureCollection', features };
}

export function downloadText(fileName: string, text: string, type: string) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Revoke after the click has been handled, or some browsers cancel the download.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
