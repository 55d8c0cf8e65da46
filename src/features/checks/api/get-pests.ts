// GET /api/pests: the pest library for the pest picker and the table's pest editor (same cache entry as
// the admin's pest list, so the library loads once).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Pest } from '../../../types/api.ts';

export const getPests = (includeInactive: boolean) => api<{ pests: Pest[] }>('/api/pests', { query: { includeInactive } }).then((r) => r.pests);
export const pestsQueryOptions = (includeInactive = false) =>
  queryOptions({ queryKey: ['pests', { includeInactive }], queryFn: () => getPests(includeInactive) });
export const usePests = (includeInactive = false) => useQuery(pestsQueryOptions(includeInactive));
