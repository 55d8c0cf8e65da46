// GET /api/pests: the pest library. Several features read it (admin list, pest pickers), so it lives here,
// one cache entry per includeInactive choice.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { Pest } from '../../types/api.ts';

export const getPests = (includeInactive: boolean) => api<{ pests: Pest[] }>('/api/pests', { query: { includeInactive } }).then((r) => r.pests);
export const pestsQueryOptions = (includeInactive: boolean) =>
  queryOptions({ queryKey: ['pests', { includeInactive }], queryFn: () => getPests(includeInactive) });
export const usePests = (includeInactive: boolean) => useQuery(pestsQueryOptions(includeInactive));
