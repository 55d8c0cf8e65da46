// GET /api/checks/:id/sighting-ids: the exact sightings a check took in, apart from its answer since they grow
// with the field. The check comparison and the zone editor read it.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { CheckSightingIdsResponse } from '@shared/schemas/checks.ts';

export const getCheckSightingIds = (checkId: string) =>
  api<CheckSightingIdsResponse>(`/api/checks/${encodeURIComponent(checkId)}/sighting-ids`).then((r) => r.sightingIds);
export const checkSightingIdsQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'sighting-ids'] as const;

export const checkSightingIdsQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: checkSightingIdsQueryKey(checkId),
    queryFn: () => getCheckSightingIds(checkId),
    // A check's sightings are fixed when it is asked for.
    staleTime: Infinity,
  });

export const useCheckSightingIds = (checkId: string | null) => useQuery({ ...checkSightingIdsQueryOptions(checkId ?? ''), enabled: Boolean(checkId) });
