import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FarmResponse } from '@shared/schemas/farms.ts';

export const getFarm = (id: string) => api<FarmResponse>(`/api/farms/${encodeURIComponent(id)}`).then((r) => r.farm);
export const farmQueryKey = (id: string) => ['farms', 'detail', id] as const;
export const farmQueryOptions = (id: string) => queryOptions({ queryKey: farmQueryKey(id), queryFn: () => getFarm(id) });
export const useFarm = (id: string) => useQuery(farmQueryOptions(id));
