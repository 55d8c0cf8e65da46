// GET /api/checks/:id/quadrats: a finished check's quadrat cells, fetched only when the map's quadrat grid opens.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckQuadratsResponse } from '@shared/schemas/checks.ts';

export const getCheckQuadrats = (checkId: string) => api<CheckQuadratsResponse>(`/api/checks/${encodeURIComponent(checkId)}/quadrats`);
export const checkQuadratsQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'quadrats'] as const;

export const checkQuadratsQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: checkQuadratsQueryKey(checkId),
    queryFn: () => getCheckQuadrats(checkId),
    // A finished check's cells never change.
    staleTime: Infinity,
  });

export const useCheckQuadrats = (checkId: string) => useQuery(checkQuadratsQueryOptions(checkId));
