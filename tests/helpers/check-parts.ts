// A check's answer with the parts served by routes of their own put back where the engine returns them, so a
// test can hold the whole of it against analyse() run on the same inputs.
import { expect } from 'vitest';
import type { MultiPolygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import type { Client } from './http.ts';
import { withDensityGrid } from './density-grid.ts';

type Figures = Record<string, unknown>;
const object = (value: unknown) => (value && typeof value === 'object' ? (value as Figures) : null);

/** GET /api/checks/:id/<part>, expecting 200. */
export async function fetchCheckPart(client: Client, checkId: string, part: 'stops' | 'quadrats' | 'scouted-area' | 'not-scouted-area' | 'sighting-ids') {
  return (await client.get(`/api/checks/${checkId}/${part}`).expect(200)).body;
}

export async function withCheckParts(client: Client, check: { id: string; result: Figures | null }) {
  const withGrid = (await withDensityGrid(client, check)) as Figures | null;
  if (!withGrid) return withGrid;
  const [stops, quadrats, area] = await Promise.all([
    fetchCheckPart(client, check.id, 'stops'),
    fetchCheckPart(client, check.id, 'quadrats'),
    fetchCheckPart(client, check.id, 'scouted-area'),
  ]);
  const put = (key: string, extra: Figures, counted?: string) => {
    const part = object(withGrid[key]);
    if (!part) return part;
    const { [counted ?? '']: _count, ...rest } = part;
    return { ...rest, ...extra };
  };
  return {
    ...withGrid,
    stops: put('stops', { merges: stops.merges }),
    counts: put('counts', { giStar: stops.giStar }),
    quadrat: put('quadrat', { cells: quadrats.quadratCells }, 'cellCount'),
    stopsQuadrat: put('stopsQuadrat', { cells: quadrats.stopsQuadratCells }, 'cellCount'),
    scouted: put('scouted', { scouted: area.scouted, notScouted: area.notScouted }, 'notScoutedParts'),
  };
}

type WithScouted = { scouted?: { scouted?: MultiPolygon; notScouted?: MultiPolygon } | null };

function withoutScoutedPolygons(result: unknown) {
  const { scouted, ...rest } = result as WithScouted & Figures;
  if (!scouted) return { ...rest, scouted };
  const { scouted: _scouted, notScouted: _notScouted, ...scalars } = scouted;
  return { ...rest, scouted: scalars };
}

/** Spheroid areas (m²) and bounding boxes of two MultiPolygons, as PostGIS measures them. */
async function measuredPair(served: MultiPolygon, computed: MultiPolygon) {
  const [row] = await sequelize.query<{ servedM2: number; computedM2: number; box: number[] }>(
    `WITH g AS (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:served), 4326) AS s, ST_SetSRID(ST_GeomFromGeoJSON(:computed), 4326) AS c)
     SELECT ST_Area(CAST(s AS geography)) AS "servedM2", ST_Area(CAST(c AS geography)) AS "computedM2",
            ARRAY[ST_XMin(s) - ST_XMin(c), ST_YMin(s) - ST_YMin(c), ST_XMax(s) - ST_XMax(c), ST_YMax(s) - ST_YMax(c)] AS box FROM g`,
    { replacements: { served: JSON.stringify(served), computed: JSON.stringify(computed) }, type: QueryTypes.SELECT },
  );
  return row;
}

/**
 * The served answer (parts put back) against the engine's result on the same inputs: every figure exactly, and the
 * scouted-area polygons as stored, snapped to a grid of 1e-6° (server/queries/pattern-checks.ts): measured by PostGIS
 * on the spheroid, the same area within 0.1 % and the same bounding box within one grid step.
 */
export async function expectServedAsComputed(served: unknown, computed: unknown) {
  expect(withoutScoutedPolygons(served)).toEqual(withoutScoutedPolygons(computed));
  const a = (served as WithScouted).scouted;
  const b = (computed as WithScouted).scouted;
  for (const key of ['scouted', 'notScouted'] as const) {
    const [s, c] = [a?.[key], b?.[key]];
    if (!s || !c || !c.coordinates.length) {
      expect(s?.coordinates ?? []).toEqual(c?.coordinates ?? []);
      continue;
    }
    const measured = await measuredPair(s, c);
    expect(Math.abs(measured.servedM2 / measured.computedM2 - 1), key).toBeLessThan(0.001);
    for (const shift of measured.box) expect(Math.abs(shift), key).toBeLessThanOrEqual(1e-6);
  }
}
