// The pest library, for zones drawn by hand without a check.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Pest } from '../../../types/api.ts';

export const getZonePests = () => api<{ pests: Pest[] }>('/api/pests').then((r) => r.pests);
export const zonePestsQueryOptions = () => queryOptions({ queryKey: ['pests', 'list'], queryFn: getZonePests });
export const useZonePests = () => useQuery(zonePestsQueryOptions());
