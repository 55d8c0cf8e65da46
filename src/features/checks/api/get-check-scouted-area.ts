// GET /api/checks/:id/scouted-area: a finished check's scouted and not-scouted polygons, fetched only while the
// map's not-scouted layer is on.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckScoutedAreaResponse } from '@shared/schemas/checks.ts';

export const getCheckScoutedArea = (checkId: string) => api<CheckScoutedAreaResponse>(`/api/checks/${encodeURIComponent(checkId)}/scouted-area`);
export const checkScoutedAreaQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'scouted-area'] as const;

export const checkScoutedAreaQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: checkScoutedAreaQueryKey(checkId),
    queryFn: () => getCheckScoutedArea(checkId),
    // A finished check's polygons never change.
    staleTime: Infinity,
  });

export const useCheckScoutedArea = (checkId: string) => useQuery(checkScoutedAreaQueryOptions(checkId));
