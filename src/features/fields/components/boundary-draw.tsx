// Drawing and editing a boundary on the map with the Leaflet-Geoman plugin; every change is
// reported as one MultiPolygon (or null when nothing is drawn).
import { useEffect, useRef } from 'react';
import L from 'leaflet';
import type { MultiPolygon, Polygon, Position } from 'geojson';
import { useMap } from 'react-leaflet';
import { addPolygonEditing } from '../../../components/map-editing.ts';

function drawnBoundary(map: L.Map): MultiPolygon | null {
  const polygons: Position[][][] = [];
  for (const layer of map.pm.getGeomanLayers()) {
    if (!(layer instanceof L.Polygon)) continue;
    const geometry = layer.toGeoJSON().geometry as Polygon | MultiPolygon;
    if (geometry.type === 'Polygon') polygons.push(geometry.coordinates);
    else polygons.push(...geometry.coordinates);
  }
  return polygons.length ? { type: 'MultiPolygon', coordinates: polygons } : null;
}

export function BoundaryDraw({ initial, onChange }: { initial: MultiPolygon | null; onChange: (boundary: MultiPolygon | null) => void }) {
  const map = useMap();
  const report = useRef(onChange);
  report.current = onChange;
  const start = useRef(initial);

  useEffect(() => {
    addPolygonEditing(map, { cutPolygon: true });
    const emit = () => report.current(drawnBoundary(map));
    const watch = (layer: L.Layer) => {
      layer.on('pm:edit', emit);
      layer.on('pm:dragend', emit);
    };

    const existing = start.current ? L.geoJSON(start.current, { style: { color: '#2f5d3a', weight: 2.5, fillColor: '#8fbd7e', fillOpacity: 0.25 } }) : null;
    if (existing) {
      existing.eachLayer((layer) => {
        layer.addTo(map);
        watch(layer);
      });
      map.fitBounds(existing.getBounds(), { padding: [24, 24], maxZoom: 17 });
    }

    const onCreate = (event: { layer: L.Layer }) => {
      watch(event.layer);
      emit();
    };
    const onCut = (event: { layer: L.Layer }) => {
      watch(event.layer);
      emit();
    };
    map.on('pm:create', onCreate);
    map.on('pm:cut', onCut);
    map.on('pm:remove', emit);
    return () => {
      map.off('pm:create', onCreate);
      map.off('pm:cut', onCut);
      map.off('pm:remove', emit);
      map.pm.removeControls();
      for (const layer of map.pm.getGeomanLayers()) layer.remove();
    };
  }, [map]);

  return null;
}
