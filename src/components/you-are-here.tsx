// "You are here" on a map: the phone's position as a dot inside a circle of its stated accuracy, following the scout.
import { Circle, CircleMarker, Tooltip } from 'react-leaflet';
import { useWatchedPosition } from '../lib/use-watched-position.ts';
import palette from '../../tailwind.config.ts';

const { field } = palette.theme.extend.colors;
const metres = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

export function YouAreHere() {
  const watched = useWatchedPosition();
  if (watched.kind !== 'found') return null;
  const { lat, lon, accuracyM } = watched.position;
  return (
    <>
      <Circle
        center={[lat, lon]}
        radius={accuracyM}
        className="you-are-here-accuracy"
        pathOptions={{ color: field[600], weight: 1, fillColor: field[400], fillOpacity: 0.15 }}
        interactive={false}
      />
      <CircleMarker
        center={[lat, lon]}
        radius={8}
        className="you-are-here"
        pathOptions={{ color: '#ffffff', weight: 3, fillColor: field[800], fillOpacity: 1 }}
      >
        <Tooltip>You are here (within ±{metres.format(accuracyM)} m)</Tooltip>
      </CircleMarker>
    </>
  );
}
