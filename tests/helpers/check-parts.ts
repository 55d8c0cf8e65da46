// A check's answer with the parts served by routes of their own put back where the engine returns them, so a
// test can hold the whole of it against analyse() run on the same inputs.
import type { Client } from './http.ts';
import { withDensityGrid } from './density-grid.ts';

type Figures = Record<string, unknown>;
const object = (value: unknown) => (value && typeof value === 'object' ? (value as Figures) : null);

/** GET /api/checks/:id/<part>, expecting 200. */
export async function fetchCheckPart(client: Client, checkId: string, part: 'stops' | 'quadrats' | 'scouted-area' | 'sighting-ids') {
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
