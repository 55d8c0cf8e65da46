// GET /api/checks/:id/<part>: the parts of a finished check that grow with its sightings, each fetched apart from the
// check's answer when the layer, table or comparison that shows it opens. A finished check's parts never change.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { CheckNotScoutedAreaResponse, CheckQuadratsResponse, CheckSightingIdsResponse, CheckStopsResponse } from '@shared/schemas/checks.ts';

interface CheckParts {
  /** Gi* per stop and the same-stop merges: the per-stop table. */
  stops: CheckStopsResponse;
  /** The quadrat cells: the map's quadrat grid. */
  quadrats: CheckQuadratsResponse;
  /** The part of the field no stop speaks for: the map's not-scouted layer. */
  'not-scouted-area': CheckNotScoutedAreaResponse;
  /** The exact sightings the check took in (fixed when it is asked for): the comparison and the zone editor. */
  'sighting-ids': CheckSightingIdsResponse;
}
export type CheckPartName = keyof CheckParts;

export const checkPartQueryOptions = <P extends CheckPartName>(checkId: string, part: P) =>
  queryOptions({
    queryKey: ['checks', 'detail', checkId, part] as const,
    queryFn: () => api<CheckParts[P]>(`/api/checks/${encodeURIComponent(checkId)}/${part}`),
    staleTime: Infinity,
  });

/** One part of a check; nothing is fetched without a check. */
export const useCheckPart = <P extends CheckPartName>(checkId: string | null, part: P) =>
  useQuery({ ...checkPartQueryOptions(checkId ?? '', part), enabled: Boolean(checkId) });

export const useCheckStops = (checkId: string) => useCheckPart(checkId, 'stops');
export const useCheckQuadrats = (checkId: string) => useCheckPart(checkId, 'quadrats');
export const useCheckNotScoutedArea = (checkId: string) => useCheckPart(checkId, 'not-scouted-area');

/** The check's sighting ids as a plain list. */
export const useCheckSightingIds = (checkId: string | null) =>
  useQuery({ ...checkPartQueryOptions(checkId ?? '', 'sighting-ids'), enabled: Boolean(checkId), select: (r) => r.sightingIds });
