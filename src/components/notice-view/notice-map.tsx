// The notice page's map: the field boundary and the zones as vector layers (useful with no tiles). On paper the
// server's own map image (with its own legend) stands in, since a live map prints unreliably.
import { useMemo } from 'react';
import { CircleMarker, GeoJSON, Tooltip } from 'react-leaflet';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';
import { MapFrame } from '../map-frame.tsx';
import { DOT_RADIUS, ZoneLabels } from './zone-labels.tsx';

const zoneStyle = { color: '#9a3f14', weight: 2, fillColor: '#f08a4b', fillOpacity: 0.45 };
const sightingStyle = { color: '#ffffff', weight: 1, fillColor: '#352d25', fillOpacity: 1 };

export function NoticeMap({ notice }: { notice: NoticeLinkResponse['notice'] }) {
  const zones = useMemo(() => notice.zonesGeoJson.features.map((f) => ({ label: f.properties.label, geometry: f.geometry })), [notice.zonesGeoJson]);
  return (
    <figure>
      <div className="print:hidden">
        <MapFrame
          boundaries={[{ id: 'field', geometry: notice.boundary, label: notice.fieldName }]}
          label={`Map of ${notice.fieldName} with the treatment zones`}
          className="h-80 sm:h-[26rem]"
        >
          {notice.zonesGeoJson.features.map((zone) => (
            <GeoJSON key={zone.properties.label} data={zone} style={zoneStyle}>
              <Tooltip sticky>{zone.properties.label}</Tooltip>
            </GeoJSON>
          ))}
          {notice.sightings.map(([lon, lat], i) => (
            <CircleMarker key={i} center={[lat, lon]} radius={DOT_RADIUS} pathOptions={sightingStyle} interactive={false} />
          ))}
          <ZoneLabels zones={zones} sightings={notice.sightings} />
        </MapFrame>
      </div>
      <img
        src={notice.mapPath}
        alt={`Map of ${notice.fieldName} with the treatment zones and sightings`}
        className="hidden w-full max-w-xl border border-soil-300 print:block"
      />
      <figcaption className="mt-2 print:hidden flex flex-wrap items-center gap-x-4 gap-y-1 text-sm text-soil-700">
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3 w-5 rounded-sm border-2 border-field-700 bg-field-300/40" /> Field boundary
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-3 w-5 rounded-sm border-2 border-patch-700 bg-patch-400/60" /> Treatment zone
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-2.5 w-2.5 rounded-full bg-soil-800 ring-1 ring-white" /> Sighting
        </span>
      </figcaption>
    </figure>
  );
}
