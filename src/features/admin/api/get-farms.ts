import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Farm } from '../../../types/api.ts';

export const getFarms = () => api<{ farms: Farm[] }>('/api/farms').then((r) => r.farms);
export const farmsQueryOptions = () => queryOptions({ queryKey: ['farms', 'list'], queryFn: getFarms });
export const useFarms = () => useQuery(farmsQueryOptions());
