// The one map every page uses. Boundaries are drawn as vector layers, so the map stays useful
// when the tile server does not answer: the note says so and the boundaries remain.
import 'leaflet/dist/leaflet.css';
import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import L from 'leaflet';
import type { MultiPolygon, Polygon } from 'geojson';
import { GeoJSON, MapContainer, TileLayer, Tooltip, useMap } from 'react-leaflet';
import { useAppConfig } from '../lib/app-config.ts';

export interface MapBoundary {
  id: string;
  geometry: Polygon | MultiPolygon;
  label?: string;
}

const boundaryStyle: L.PathOptions = { color: '#2f5d3a', weight: 2.5, fillColor: '#8fbd7e', fillOpacity: 0.25 };
// Open farmland in the middle of a continent, shown only before any boundary exists.
const FALLBACK_CENTRE: L.LatLngTuple = [42.0, -93.6];

function FitToBoundaries({ boundaries }: { boundaries: MapBoundary[] }) {
  const map = useMap();
  const key = boundaries.map((b) => b.id).join('|');
  useEffect(() => {
    if (boundaries.length === 0) return;
    const bounds = L.geoJSON(boundaries.map((b) => ({ type: 'Feature', properties: {}, geometry: b.geometry })) as never).getBounds();
    if (bounds.isValid()) map.fitBounds(bounds, { padding: [24, 24], maxZoom: 17 });
    // Refit when the set of boundaries changes (its key), not when a parent hands a new array of the same ones.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, key]);
  return null;
}

// react-leaflet's GeoJSON reads `data` once; a changed geometry is swapped in on the same layer.
function BoundaryLayer({ boundary }: { boundary: MapBoundary }) {
  const ref = useRef<L.GeoJSON>(null);
  useEffect(() => {
    ref.current?.clearLayers().addData(boundary.geometry);
  }, [boundary.geometry]);
  return (
    <GeoJSON ref={ref} data={boundary.geometry} style={boundaryStyle}>
      {boundary.label && <Tooltip sticky>{boundary.label}</Tooltip>}
    </GeoJSON>
  );
}

function Tiles({ onFailure }: { onFailure: () => void }) {
  const config = useAppConfig();
  const url = config.data?.tileUrl;
  useEffect(() => {
    if (config.isError || (config.isSuccess && !url)) onFailure();
  }, [config.isError, config.isSuccess, url, onFailure]);
  if (!url) return null;
  return <TileLayer url={url} maxZoom={19} attribution="Map tiles" eventHandlers={{ tileerror: onFailure }} />;
}

export function MapFrame({
  boundaries,
  label,
  className = 'h-80',
  children,
}: {
  boundaries: MapBoundary[];
  /** What the map shows, for screen readers. */
  label: string;
  className?: string;
  /** Extra layers or tools (drawing controls, sightings) rendered inside the map. */
  children?: ReactNode;
}) {
  const [tilesFailed, setTilesFailed] = useState(false);
  const onFailure = useMemo(() => () => setTilesFailed(true), []);
  return (
    <div className="relative">
      <div role="region" aria-label={label} className={`overflow-hidden rounded-lg ring-1 ring-soil-300/60 ${className}`}>
        <MapContainer center={FALLBACK_CENTRE} zoom={5} className="h-full w-full !bg-straw-100" scrollWheelZoom={false}>
          <Tiles onFailure={onFailure} />
          {boundaries.map((boundary) => (
            <BoundaryLayer key={boundary.id} boundary={boundary} />
          ))}
          <FitToBoundaries boundaries={boundaries} />
          {children}
        </MapContainer>
      </div>
      {tilesFailed && (
        <p role="note" className="pointer-events-none absolute bottom-2 left-2 z-[500] rounded bg-white/90 px-2 py-1 text-xs text-soil-700 shadow-sm">
          Map tiles unavailable — boundaries still shown
        </p>
      )}
    </div>
  );
}
