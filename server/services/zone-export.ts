// Zone sets as files: GeoJSON (RFC 7946) and KML (OGC KML 2.2).
// KML is written by hand: no maintained GeoJSON-to-KML package is installed, and the subset we need
// (Placemark › MultiGeometry › Polygon with outer and inner rings, ExtendedData) is a few lines.
import type { Feature, FeatureCollection, MultiPolygon } from 'geojson';
import type { ZoneSetView } from '../../shared/schemas/zones.ts';

export interface ZoneExportProperties {
  label: string;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightingsInside: number;
}

/** RFC 7946 FeatureCollection: WGS 84 longitude/latitude, no "crs" member, exterior rings counter-clockwise. */
export function zonesGeoJson(zoneSet: Pick<ZoneSetView, 'zones'>): FeatureCollection<MultiPolygon, ZoneExportProperties> {
  return {
    type: 'FeatureCollection',
    features: zoneSet.zones.map((zone): Feature<MultiPolygon, ZoneExportProperties> => ({
      type: 'Feature',
      id: zone.id,
      properties: {
        label: zone.label,
        areaM2: zone.areaM2,
        areaHa: zone.areaHa,
        areaAc: zone.areaAc,
        shareOfField: zone.shareOfField,
        sightingsInside: zone.sightingsInside,
      },
      geometry: zone.geometry,
    })),
  };
}

const xmlText = (text: string) => text.replace(/[<>&'"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', "'": '&apos;', '"': '&quot;' })[c] as string);

// KML coordinates are "lon,lat" tuples separated by whitespace (OGC 07-147r2, §16.9.1).
const coordinates = (ring: number[][]) => ring.map(([lon, lat]) => `${lon},${lat}`).join(' ');

function polygonKml(rings: number[][][]) {
  const [outer, ...holes] = rings;
  const inner = holes.map((h) => `<innerBoundaryIs><LinearRing><coordinates>${coordinates(h)}</coordinates></LinearRing></innerBoundaryIs>`).join('');
  return `<Polygon><outerBoundaryIs><LinearRing><coordinates>${coordinates(outer)}</coordinates></LinearRing></outerBoundaryIs>${inner}</Polygon>`;
}

/** A KML 2.2 document with one Placemark per zone and its figures as ExtendedData. */
export function zonesKml(zoneSet: Pick<ZoneSetView, 'zones' | 'version'>, title: string): string {
  const placemarks = zoneSet.zones.map((zone) => {
    const data = (
      [
        ['areaHa', zone.areaHa.toFixed(4)],
        ['areaAc', zone.areaAc.toFixed(4)],
        ['areaM2', zone.areaM2.toFixed(1)],
        ['shareOfField', zone.shareOfField.toFixed(4)],
        ['sightingsInside', String(zone.sightingsInside)],
      ] as const
    )
      .map(([name, value]) => `<Data name="${name}"><value>${value}</value></Data>`)
      .join('');
    return `    <Placemark><name>${xmlText(zone.label)}</name><description>${xmlText(`${zone.areaHa.toFixed(2)} ha (${zone.areaAc.toFixed(2)} ac)`)}</description><ExtendedData>${data}</ExtendedData><MultiGeometry>${zone.geometry.coordinates.map(polygonKml).join('')}</MultiGeometry></Placemark>`;
  });
  return `<?xml version="1.0" encoding="UTF-8"?>
<kml xmlns="http://www.opengis.net/kml/2.2">
  <Document>
    <name>${xmlText(`${title} — zones version ${zoneSet.version}`)}</name>
${placemarks.join('\n')}
  </Document>
</kml>
`;
}

/** A file name made of safe characters only. */
export const exportFileName = (title: string, version: number, extension: string) =>
  `${
    title
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'zones'
  }-v${version}.${extension}`;
