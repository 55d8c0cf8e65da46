// Sightings on one canvas (L.canvas): thousands of circles stay smooth where one SVG element each would not.
// Found sightings are filled, area growing with the count; empty stops are hollow rings.
import { useEffect, useMemo, useRef } from 'react';
import L from 'leaflet';
import { useMap } from 'react-leaflet';
import type { SightingView } from '@shared/schemas/sightings.ts';
import palette from '../../../../../tailwind.config.ts';

const { patch, soil, field } = palette.theme.extend.colors;

/** Radius grows with the square root of the count, so the circle's area follows the count. */
export function dotRadius(count: number | null) {
  return Math.min(16, 4 + 1.6 * Math.sqrt(Math.max(0, count ?? 1)));
}

export function SightingDots({ sightings, selectedId, onSelect }: { sightings: SightingView[]; selectedId: string | null; onSelect: (id: string) => void }) {
  const map = useMap();
  const renderer = useMemo(() => L.canvas({ padding: 0.3, tolerance: 4 }), []);
  const select = useRef(onSelect);
  select.current = onSelect;

  useEffect(() => {
    const group = L.layerGroup();
    for (const s of sightings) {
      if (!s.position) continue;
      const selected = s.id === selectedId;
      const style: L.CircleMarkerOptions = s.isEmptyStop
        ? { renderer, radius: 4, color: soil[700], weight: 1.5, fill: false }
        : {
            renderer,
            radius: dotRadius(s.count),
            color: selected ? field[900] : patch[700],
            weight: selected ? 3 : 1,
            fillColor: patch[500],
            fillOpacity: 0.7,
          };
      const marker = L.circleMarker([s.position.lat, s.position.lon], style);
      marker.on('click', () => select.current(s.id));
      group.addLayer(marker);
    }
    group.addTo(map);
    return () => {
      group.remove();
    };
  }, [map, renderer, sightings, selectedId]);
  return null;
}
