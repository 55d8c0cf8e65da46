// GET /api/checks/:id/not-scouted-area: the part of a finished check's field no stop speaks for, fetched only while
// the map's not-scouted layer is on (the scouted polygons themselves are not drawn, so they are not fetched).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckNotScoutedAreaResponse } from '@shared/schemas/checks.ts';

export const getCheckNotScoutedArea = (checkId: string) => api<CheckNotScoutedAreaResponse>(`/api/checks/${encodeURIComponent(checkId)}/not-scouted-area`);
export const checkNotScoutedAreaQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'not-scouted-area'] as const;

export const checkNotScoutedAreaQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: checkNotScoutedAreaQueryKey(checkId),
    queryFn: () => getCheckNotScoutedArea(checkId),
    // A finished check's polygons never change.
    staleTime: Infinity,
  });

export const useCheckNotScoutedArea = (checkId: string) => useQuery(checkNotScoutedAreaQueryOptions(checkId));
