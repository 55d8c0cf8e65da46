// The ground a walk covered: a dashed line through its stops and sightings in the order they were recorded.
import { Polyline } from 'react-leaflet';
import type { SightingView } from '@shared/schemas/sightings.ts';
import palette from '../../../../tailwind.config.ts';

const { soil } = palette.theme.extend.colors;

const recordedAt = (s: SightingView) => Date.parse(s.observedAt ?? s.createdAt);

export function WalkRouteLine({ sightings }: { sightings: SightingView[] }) {
  const stops = sightings.filter((s) => s.position).sort((a, b) => recordedAt(a) - recordedAt(b));
  if (stops.length < 2) return null;
  return (
    <Polyline
      positions={stops.map((s) => [s.position!.lat, s.position!.lon])}
      className="walk-route"
      interactive={false}
      pathOptions={{ color: soil[700], weight: 2, dashArray: '6 6', opacity: 0.8 }}
    />
  );
}
