// The live map's zone labels: placed in the map's own pixels at each zoom (inside the zone clear of the sighting
// dots and edges, or beside it with a leader line), the same placement the e-mailed map image uses.
import { Fragment, useEffect, useState } from 'react';
import L from 'leaflet';
import { Marker, Polyline, useMap } from 'react-leaflet';
import type { MultiPolygon, Position } from 'geojson';
import { boxEdgePointToward, labelSize, placeZoneLabels, type PlacedLabel, type XY } from '@shared/notices/zone-label-placement.ts';

const FONT = 14;
export const DOT_RADIUS = 5;

interface ZoneToLabel {
  label: string;
  geometry: MultiPolygon;
}

function usePlacedLabels(zones: ZoneToLabel[], sightings: Position[]) {
  const map = useMap();
  const [placed, setPlaced] = useState<PlacedLabel[]>([]);
  useEffect(() => {
    const place = () => {
      const toPixel = ([lon, lat]: Position): XY => {
        const p = map.latLngToLayerPoint([lat, lon]);
        return [p.x, p.y];
      };
      const requests = zones.map((z) => ({ polygons: z.geometry.coordinates.map((p) => p.map((r) => r.map(toPixel))), ...labelSize(z.label, FONT, 6) }));
      setPlaced(placeZoneLabels(requests, sightings.map(toPixel), { dotRadius: DOT_RADIUS + 1, gap: 2 }));
    };
    place();
    map.on('zoomend viewreset', place);
    return () => {
      map.off('zoomend viewreset', place);
    };
  }, [map, zones, sightings]);
  return placed;
}

export function ZoneLabels({ zones, sightings }: { zones: ZoneToLabel[]; sightings: Position[] }) {
  const map = useMap();
  const placed = usePlacedLabels(zones, sightings);
  const toLatLng = ([x, y]: XY) => map.layerPointToLatLng([x, y]);
  return (
    <>
      {placed.map((p, i) => {
        const zone = zones[i];
        if (!zone) return null;
        const width = p.box.x1 - p.box.x0;
        const height = p.box.y1 - p.box.y0;
        const icon = L.divIcon({
          className: 'zone-label',
          html: `<span data-zone-label="${zone.label.replace(/"/g, '&quot;')}" style="display:flex;width:${width}px;height:${height}px;align-items:center;justify-content:center">${zone.label.replace(/[<>&]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;' })[c] as string)}</span>`,
          iconSize: [width, height],
          iconAnchor: [width / 2, height / 2],
        });
        return (
          <Fragment key={zone.label}>
            {p.leaderTo && (
              <Polyline
                positions={[toLatLng(boxEdgePointToward(p.box, p.leaderTo)), toLatLng(p.leaderTo)]}
                pathOptions={{ color: '#241e19', weight: 1.5 }}
                interactive={false}
              />
            )}
            <Marker position={toLatLng(p.centre)} icon={icon} interactive={false} keyboard={false} />
          </Fragment>
        );
      })}
    </>
  );
}
