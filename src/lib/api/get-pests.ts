// GET /api/pests: the pest library. Several features read it (admin list, pest pickers, the zone editor),
// so it lives here, one cache entry per includeInactive choice.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { PestListResponse } from '@shared/schemas/pests.ts';

export const getPests = (includeInactive: boolean) => api<PestListResponse>('/api/pests', { query: { includeInactive } }).then((r) => r.pests);
/** Every cached copy of the library: what a change to a pest invalidates. */
export const pestsQueryKey = ['pests'] as const;
export const pestsQueryOptions = (includeInactive: boolean) =>
  queryOptions({ queryKey: [...pestsQueryKey, { includeInactive }], queryFn: () => getPests(includeInactive) });
export const usePests = (includeInactive: boolean) => useQuery(pestsQueryOptions(includeInactive));
