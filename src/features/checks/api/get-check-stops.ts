// GET /api/checks/:id/stops: a finished check's per-stop figures (Gi* per stop, same-stop merges), fetched only
// when the adviser opens the table of each stop's figures.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckStopsResponse } from '@shared/schemas/checks.ts';

export const getCheckStops = (checkId: string) => api<CheckStopsResponse>(`/api/checks/${encodeURIComponent(checkId)}/stops`);
export const checkStopsQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'stops'] as const;

export const checkStopsQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: checkStopsQueryKey(checkId),
    queryFn: () => getCheckStops(checkId),
    // A finished check's figures never change.
    staleTime: Infinity,
  });

export const useCheckStops = (checkId: string) => useQuery(checkStopsQueryOptions(checkId));
