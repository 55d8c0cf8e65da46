// PostGIS computations that read no table: the database is the reference for what a valid geometry is.
import type { MultiPolygon } from 'geojson';
import { selectRow } from './sql.ts';

export interface ValidityDetail {
  valid: boolean;
  reason: string | null;
  x: number | null;
  y: number | null;
}

/** Whether PostGIS takes the boundary as valid, and if not why and where. */
export const boundaryValidity = async (boundary: MultiPolygon) =>
  (await selectRow<ValidityDetail>(
    `SELECT d.valid, d.reason, ST_X(d.location) AS x, ST_Y(d.location) AS y
       FROM ST_IsValidDetail(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326)) d`,
    { geojson: JSON.stringify(boundary) },
  ))!;
