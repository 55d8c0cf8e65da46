// The farms linked to the grower's account, so a farm with no field yet still shows.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Farm } from '../../../types/api.ts';

export const getGrowerFarms = () => api<{ farms: Farm[] }>('/api/farms').then((r) => r.farms);
// Same key as the farms list elsewhere: one cached copy.
export const growerFarmsQueryOptions = () => queryOptions({ queryKey: ['farms', 'list'], queryFn: getGrowerFarms });
export const useGrowerFarms = () => useQuery(growerFarmsQueryOptions());
