import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Farm } from '../../../types/api.ts';

export const getFarm = (id: string) => api<{ farm: Farm }>(`/api/farms/${id}`).then((r) => r.farm);
export const farmQueryOptions = (id: string) => queryOptions({ queryKey: ['farms', 'detail', id], queryFn: () => getFarm(id) });
export const useFarm = (id: string) => useQuery(farmQueryOptions(id));
