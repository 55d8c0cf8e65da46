// Sightings on a Leaflet map: filled circles sized by count, hollow rings for empty stops.
import { CircleMarker, Tooltip } from 'react-leaflet';
import type { SightingView } from '@shared/schemas/sightings.ts';
import palette from '../../../../tailwind.config.ts';

// The one palette: the warm accent marks what was found, soil for where nothing was.
const { patch, soil } = palette.theme.extend.colors;

/** Area grows with the count (radius with its square root), so a heavy sighting does not swamp the map. */
export function markerRadius(count: number | null) {
  return Math.min(22, 7 + 2.5 * Math.sqrt(Math.max(0, count ?? 0)));
}

export function SightingMarkers({ sightings }: { sightings: SightingView[] }) {
  return (
    <>
      {sightings.map((s) =>
        s.position ? (
          <CircleMarker
            key={s.id}
            center={[s.position.lat, s.position.lon]}
            radius={s.isEmptyStop ? 7 : markerRadius(s.count)}
            // Leaflet reads className only when the path is made, so it goes in as an option, not a style.
            className={s.isEmptyStop ? 'sighting-marker empty-stop' : 'sighting-marker'}
            pathOptions={
              s.isEmptyStop ? { color: soil[800], weight: 3, fill: false } : { color: patch[700], weight: 2, fillColor: patch[500], fillOpacity: 0.85 }
            }
          >
            <Tooltip>{s.isEmptyStop ? `Nothing found (${s.pestName})` : `${s.pestName}: ${s.count ?? 'no count'}`}</Tooltip>
          </CircleMarker>
        ) : null,
      )}
    </>
  );
}
