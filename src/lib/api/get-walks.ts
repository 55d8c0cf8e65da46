import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { WalkListResponse } from '@shared/schemas/walks.ts';

export const getWalks = (fieldId?: string) => api<WalkListResponse>('/api/walks', { query: { fieldId } });

/** Every field's walk list (a photo uploaded without a walk may start one on any field). */
export const walkListsQueryKey = ['walks', 'list'] as const;
export const walksQueryKey = (fieldId: string) => [...walkListsQueryKey, { fieldId }] as const;

export const walksQueryOptions = (fieldId: string) => queryOptions({ queryKey: walksQueryKey(fieldId), queryFn: () => getWalks(fieldId) });

export const useWalks = (fieldId: string) => useQuery(walksQueryOptions(fieldId));

/** Every walk the signed-in user may see, on all their fields (a scout's field list marks today's finished walks). */
export const allWalksQueryKey = [...walkListsQueryKey, 'all'] as const;

export const useAllWalks = () => useQuery({ queryKey: allWalksQueryKey, queryFn: () => getWalks() });
