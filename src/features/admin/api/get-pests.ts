import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Pest } from '../../../types/api.ts';

export const getPests = (includeInactive: boolean) => api<{ pests: Pest[] }>('/api/pests', { query: { includeInactive } }).then((r) => r.pests);
export const pestsQueryOptions = (includeInactive = true) =>
  queryOptions({ queryKey: ['pests', { includeInactive }], queryFn: () => getPests(includeInactive) });
export const usePests = (includeInactive = true) => useQuery(pestsQueryOptions(includeInactive));
