import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkListResponse } from '@shared/schemas/walks.ts';

export const getWalks = (fieldId: string) => api<WalkListResponse>('/api/walks', { query: { fieldId } });

export const walksQueryOptions = (fieldId: string) => queryOptions({ queryKey: ['walks', 'list', { fieldId }], queryFn: () => getWalks(fieldId) });

export const useWalks = (fieldId: string) => useQuery(walksQueryOptions(fieldId));
