// What waits on the phone, on the walk map: dashed rings, so a scout sees the stops and photos not yet sent.
import { CircleMarker, Tooltip } from 'react-leaflet';
import palette from '../../../../tailwind.config.ts';

const { straw, patch } = palette.theme.extend.colors;

export interface QueuedPlace {
  clientId: string;
  kind: 'photo' | 'stop';
  lon: number;
  lat: number;
  refused: boolean;
}

export function QueuedMarkers({ places }: { places: QueuedPlace[] }) {
  return (
    <>
      {places.map((p) => (
        <CircleMarker
          key={p.clientId}
          center={[p.lat, p.lon]}
          radius={8}
          className="queued-marker"
          pathOptions={{ color: p.refused ? patch[700] : straw[500], weight: 3, dashArray: '4 3', fillColor: straw[200], fillOpacity: 0.6 }}
        >
          <Tooltip>
            {p.kind === 'stop' ? 'Empty stop' : 'Photo'} {p.refused ? 'not accepted' : 'waiting on this phone'}
          </Tooltip>
        </CircleMarker>
      ))}
    </>
  );
}
