// Editing treatment zones on the map with the Leaflet-Geoman plugin: move vertices, drag, draw a zone by
// hand, remove one. The field boundary on the same map stays out of every editing mode.
import { useEffect, useRef } from 'react';
import L from 'leaflet';
import type { MultiPolygon, Polygon } from 'geojson';
import { useMap } from 'react-leaflet';
import { addPolygonEditing } from '../../../components/map-editing.ts';
import type { WorkingZone } from '../working-zones.ts';

export const zoneStyle: L.PathOptions = { color: '#9a3f14', weight: 2, fillColor: '#f08a4b', fillOpacity: 0.4 };

export interface ZoneEditHandlers {
  onReshape: (key: string, geometry: Polygon | MultiPolygon) => void;
  onRemove: (key: string) => void;
  onDraw: (geometry: Polygon) => void;
}

const geometryOf = (layer: L.Polygon) => layer.toGeoJSON().geometry as Polygon | MultiPolygon;

/**
 * `revision` changes whenever the zones are replaced from outside the map (a new proposal, a row deleted
 * in the table, a zone drawn); edits made on the map itself report back without rebuilding the layers.
 */
export function ZoneEditLayer({ zones, revision, handlers }: { zones: WorkingZone[]; revision: number; handlers: ZoneEditHandlers }) {
  const map = useMap();
  const report = useRef(handlers);
  report.current = handlers;
  const current = useRef(zones);
  current.current = zones;
  const keys = useRef(new Map<L.Layer, string>());

  useEffect(() => {
    addPolygonEditing(map, { cutPolygon: false });
    // The boundary (drawn by the map frame) must not be edited, dragged or removed with the zones.
    const protect = (layer: L.Layer) => {
      if (layer instanceof L.Path && !keys.current.has(layer) && !(layer as { _pmTempLayer?: boolean })._pmTempLayer) layer.options.pmIgnore = true;
    };
    map.eachLayer(protect);
    const onLayerAdd = (event: L.LayerEvent) => protect(event.layer);
    const onCreate = (event: { layer: L.Layer }) => {
      // The drawn layer is handed to the zone list, which draws it again as one of the zones.
      const geometry = geometryOf(event.layer as L.Polygon);
      event.layer.remove();
      if (geometry.type === 'Polygon') report.current.onDraw(geometry);
    };
    const onRemove = (event: { layer: L.Layer }) => {
      const key = keys.current.get(event.layer);
      if (key) report.current.onRemove(key);
    };
    map.on('layeradd', onLayerAdd);
    map.on('pm:create', onCreate);
    map.on('pm:remove', onRemove);
    return () => {
      map.off('layeradd', onLayerAdd);
      map.off('pm:create', onCreate);
      map.off('pm:remove', onRemove);
      map.pm.removeControls();
    };
  }, [map]);

  useEffect(() => {
    const layers: L.Layer[] = [];
    const zoneKeys = keys.current;
    for (const zone of current.current) {
      const group = L.geoJSON(zone.geometry, { style: zoneStyle, pmIgnore: false } as L.GeoJSONOptions);
      group.eachLayer((layer) => {
        zoneKeys.set(layer, zone.key);
        const reshape = () => report.current.onReshape(zone.key, geometryOf(layer as L.Polygon));
        layer.on('pm:edit', reshape);
        layer.on('pm:dragend', reshape);
        layer.bindTooltip(zone.label, { sticky: true });
        layer.addTo(map);
        layers.push(layer);
      });
    }
    // Layers added while a mode is on join that mode (edit handles appear on a fresh proposal too).
    if (map.pm.globalEditModeEnabled()) map.pm.enableGlobalEditMode();
    return () => {
      for (const layer of layers) {
        zoneKeys.delete(layer);
        layer.off();
        layer.remove();
      }
    };
  }, [map, revision]);

  return null;
}
