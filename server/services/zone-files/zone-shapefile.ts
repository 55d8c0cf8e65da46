// Zones as a shapefile in WGS 84 (.shp/.shx/.dbf/.prj, zipped), one polygon record per zone, written
// with @mapbox/shp-write.
import shpwrite from '@mapbox/shp-write';
import type { Feature, FeatureCollection, MultiPolygon } from 'geojson';
import JSZip from 'jszip';
import { MACHINE_FILE_CAUTION } from '../../../shared/notices/cautions.ts';
import type { ZoneFileSource } from './zone-file-source.ts';

// dBASE field names hold at most 10 characters, so the attribute names are short and listed in README.TXT.
export interface ZoneShapefileAttributes {
  ZONE: number;
  LABEL: string;
  AREA_HA: number;
  AREA_AC: number;
  STOPS: number;
  MEAN_CNT: number | null;
  THRESHOLD: number;
  CNT_UNIT: string;
  FIELD: string;
  FARM: string;
  PEST: string;
  VERSION: number;
}

const round = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;

export function zoneShapefileFeatures(source: ZoneFileSource): FeatureCollection<MultiPolygon, ZoneShapefileAttributes> {
  return {
    type: 'FeatureCollection',
    features: source.zones.map((zone): Feature<MultiPolygon, ZoneShapefileAttributes> => ({
      type: 'Feature',
      // Every zone as a MultiPolygon, so all of them land in one layer of polygon records.
      geometry: zone.geometry,
      properties: {
        ZONE: zone.number,
        LABEL: zone.label.slice(0, 80),
        AREA_HA: round(zone.areaHa, 4),
        AREA_AC: round(zone.areaAc, 4),
        STOPS: zone.stops,
        MEAN_CNT: zone.meanCount === null ? null : round(zone.meanCount, 3),
        THRESHOLD: source.threshold,
        CNT_UNIT: source.countUnit.slice(0, 40),
        FIELD: source.fieldName.slice(0, 80),
        FARM: source.farmName.slice(0, 80),
        PEST: source.pestName.slice(0, 80),
        VERSION: source.version,
      },
    })),
  };
}

/** The zip: `<layer>.shp/.shx/.dbf/.prj` (WGS 84 geographic) and a README.TXT with the attributes and cautions. */
export async function zonesShapefileZip(source: ZoneFileSource, layerName: string): Promise<Buffer> {
  const written = await shpwrite.zip<'nodebuffer'>(zoneShapefileFeatures(source) as GeoJSON.FeatureCollection, {
    outputType: 'nodebuffer',
    compression: 'DEFLATE',
    types: { polygon: layerName, multipolygon: layerName },
  });
  const zip = await JSZip.loadAsync(written);
  zip.file('README.TXT', readme(source, layerName));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

function readme(source: ZoneFileSource, layerName: string) {
  return [
    `Treatment zones for ${source.pestName} on ${source.fieldName}, ${source.farmName}; zone set version ${source.version}.`,
    `${layerName}.shp holds one polygon per zone in WGS 84 longitude/latitude (${layerName}.prj).`,
    'Attributes: ZONE zone number; LABEL its name; AREA_HA and AREA_AC its area; STOPS scouting stops inside it;',
    `MEAN_CNT the mean count per stop inside it (zeros included), against THRESHOLD, the action threshold in CNT_UNIT (${source.countUnit}; source: ${source.thresholdSource});`,
    'FIELD, FARM, PEST and VERSION say which zone set the file is.',
    '',
    MACHINE_FILE_CAUTION,
    '',
  ].join('\r\n');
}
