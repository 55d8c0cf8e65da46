// The notices sent about the grower's own farms, with the state of the grower's own copy.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { GrowerNoticesResponse } from '@shared/schemas/notices.ts';

export const getGrowerNotices = () => api<GrowerNoticesResponse>('/api/grower/notices').then((r) => r.notices);
export const growerNoticesQueryOptions = () => queryOptions({ queryKey: ['grower', 'notices'], queryFn: getGrowerNotices });
export const useGrowerNotices = () => useQuery(growerNoticesQueryOptions());
