// The engine's planar grids (quadrat cells, density surface) carry coordinates in the CRS it reports;
// they go back to longitude/latitude through proj4 with the engine's own definition, for drawing only.
import proj4 from 'proj4';

export type ToLonLat = (x: number, y: number) => [number, number];

export function planarToLonLat(crsDefinition: string | null): ToLonLat | null {
  if (!crsDefinition) return null;
  const converter = proj4(crsDefinition, 'WGS84');
  return (x, y) => converter.forward([x, y]) as [number, number];
}
