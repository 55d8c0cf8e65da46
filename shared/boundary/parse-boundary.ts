// Turns an uploaded boundary (GeoJSON in any of its wrappers, or KML) into one MultiPolygon.
import { kml as kmlToGeoJson } from '@tmcw/togeojson';
import type { Geometry, MultiPolygon, Position } from 'geojson';
import { refuseDeepNesting } from './collection-depth.ts';
import { fault } from './boundary-faults.ts';

type DomParserConstructor = new () => { parseFromString(text: string, type: string): unknown };

function polygonsOf(value: unknown, found: Position[][][]): void {
  if (!value || typeof value !== 'object')
    throw fault('not-polygon', 'The file holds no GeoJSON geometry: expected a Polygon, MultiPolygon, Feature or FeatureCollection.');
  const node = value as { type?: unknown; coordinates?: unknown; geometry?: unknown; features?: unknown; geometries?: unknown };
  switch (node.type) {
    case 'Polygon':
      if (!Array.isArray(node.coordinates)) throw fault('unparseable', 'A Polygon needs a "coordinates" array of rings.');
      found.push(node.coordinates as Position[][]);
      return;
    case 'MultiPolygon':
      if (!Array.isArray(node.coordinates)) throw fault('unparseable', 'A MultiPolygon needs a "coordinates" array of polygons.');
      found.push(...(node.coordinates as Position[][][]));
      return;
    case 'Feature':
      if (!node.geometry) throw fault('not-polygon', 'The Feature has no geometry.');
      polygonsOf(node.geometry, found);
      return;
    case 'FeatureCollection':
      if (!Array.isArray(node.features)) throw fault('unparseable', 'A FeatureCollection needs a "features" array.');
      for (const feature of node.features) polygonsOf(feature, found);
      return;
    case 'GeometryCollection':
      if (!Array.isArray(node.geometries)) throw fault('unparseable', 'A GeometryCollection needs a "geometries" array.');
      for (const geometry of node.geometries) polygonsOf(geometry, found);
      return;
    case 'Point':
    case 'MultiPoint':
    case 'LineString':
    case 'MultiLineString':
      throw fault('not-polygon', `The boundary is a ${node.type}, not a polygon: a field boundary must be a Polygon or MultiPolygon.`);
    default:
      throw fault('not-polygon', 'The file holds no GeoJSON geometry: expected a Polygon, MultiPolygon, Feature or FeatureCollection.');
  }
}

/** Collects every polygon in a GeoJSON value into one MultiPolygon. */
export function boundaryFromGeoJson(value: unknown): MultiPolygon {
  const polygons: Position[][][] = [];
  polygonsOf(value, polygons);
  if (polygons.length === 0) throw fault('not-polygon', 'The file holds no polygon: a field boundary must be a Polygon or MultiPolygon.');
  return { type: 'MultiPolygon', coordinates: polygons };
}

function looksLikeXml(text: string) {
  return text.trimStart().startsWith('<');
}

/** Parses the text of a .geojson/.json or .kml file. */
export function parseBoundaryText(text: string, DOMParser: DomParserConstructor): MultiPolygon {
  if (looksLikeXml(text)) {
    let geojson: { features: Array<{ geometry: Geometry | null }> };
    try {
      const doc = new DOMParser().parseFromString(text, 'text/xml') as Parameters<typeof kmlToGeoJson>[0];
      geojson = kmlToGeoJson(doc) as typeof geojson;
    } catch {
      throw fault('unparseable', 'The KML file could not be read: check that it is complete, well-formed XML.');
    }
    const geometries = geojson.features.map((f) => f.geometry).filter(Boolean);
    if (geometries.length === 0) throw fault('not-polygon', 'The KML file holds no Polygon placemark: a field boundary must be a polygon.');
    return boundaryFromGeoJson({ type: 'GeometryCollection', geometries });
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw fault('unparseable', 'The file is neither GeoJSON nor KML: it could not be read as JSON or XML.');
  }
  refuseDeepNesting(value);
  return boundaryFromGeoJson(value);
}
