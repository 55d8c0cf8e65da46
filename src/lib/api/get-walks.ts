// GET /api/walks for one field: newest first, a page at a time (the field hub and the scout's list show the first
// page and load the next on "Show more").
import { infiniteQueryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import { WALK_PAGE, type WalkListResponse } from '@shared/schemas/walks.ts';

export const getWalks = (fieldId: string | undefined, limit: number, cursor?: string) =>
  api<WalkListResponse>('/api/walks', { query: { fieldId, limit, cursor } });

/** Every field's walk list (a photo uploaded without a walk may start one on any field). */
export const walkListsQueryKey = ['walks', 'list'] as const;
export const walksQueryKey = (fieldId: string) => [...walkListsQueryKey, { fieldId }] as const;

export const walksQueryOptions = (fieldId: string, pageSize: number = WALK_PAGE.default) =>
  infiniteQueryOptions({
    queryKey: [...walksQueryKey(fieldId), { pageSize }],
    queryFn: ({ pageParam }) => getWalks(fieldId, pageSize, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.nextCursor ?? undefined,
    // The pages joined, newest first.
    select: (data) => data.pages.flatMap((page) => page.walks),
  });

export const useWalks = (fieldId: string, pageSize?: number) => useInfiniteQuery(walksQueryOptions(fieldId, pageSize));

/**
 * The newest walks the signed-in user may see, on all their fields (a scout's field list marks today's finished walks):
 * one page at the largest size, newest day first, which holds every walk of today.
 */
export const allWalksQueryKey = [...walkListsQueryKey, 'all'] as const;

export const useAllWalks = () => useQuery({ queryKey: allWalksQueryKey, queryFn: () => getWalks(undefined, WALK_PAGE.max) });
