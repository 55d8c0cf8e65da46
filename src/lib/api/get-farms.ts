// GET /api/farms: the farms the signed-in person may see (an admin's all, a grower's linked ones, so a farm
// with no field yet still shows). The admin's and the grower's pages read it.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { FarmListResponse } from '@shared/schemas/farms.ts';

export const getFarms = () => api<FarmListResponse>('/api/farms').then((r) => r.farms);
export const farmsQueryKey = ['farms', 'list'] as const;
export const farmsQueryOptions = () => queryOptions({ queryKey: farmsQueryKey, queryFn: getFarms });
export const useFarms = () => useQuery(farmsQueryOptions());
