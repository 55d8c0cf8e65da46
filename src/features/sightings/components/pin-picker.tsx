// The scout taps the map where the photo was taken; a marker shows the choice until it is confirmed.
import { CircleMarker, useMapEvents } from 'react-leaflet';
import type { Position } from '@shared/schemas/sightings.ts';
import palette from '../../../../tailwind.config.ts';

const { patch } = palette.theme.extend.colors;

export function PinPicker({ chosen, onChoose }: { chosen: Position | null; onChoose: (position: Position) => void }) {
  useMapEvents({
    click: (event) => onChoose({ lon: event.latlng.lng, lat: event.latlng.lat }),
  });
  return chosen ? (
    <CircleMarker
      center={[chosen.lat, chosen.lon]}
      radius={12}
      className="pin-choice"
      pathOptions={{ color: patch[700], weight: 3, fillColor: patch[400], fillOpacity: 0.9 }}
    />
  ) : null;
}
