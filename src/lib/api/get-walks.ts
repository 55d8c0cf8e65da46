// GET /api/walks: one field's walks newest first, a page at a time (the field hub and the scout's list show the first
// page and load the next on "Show more"); and the walks of one day or a window of days, read whole.
import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import { fetchEveryPage } from '../every-page.ts';
import { WALK_PAGE, type WalkListQuery, type WalkListResponse } from '@shared/schemas/walks.ts';

export type WalksQuery = Omit<WalkListQuery, 'limit' | 'cursor'>;

export const getWalks = (query: WalksQuery, limit: number, cursor?: string, signal?: AbortSignal) =>
  api<WalkListResponse>('/api/walks', { query: { ...query, limit, cursor }, signal });

/** Every field's walk list (a photo uploaded without a walk may start one on any field). */
export const walkListsQueryKey = ['walks', 'list'] as const;
export const walksQueryKey = (fieldId: string) => [...walkListsQueryKey, { fieldId }] as const;

export const walksQueryOptions = (fieldId: string, pageSize: number = WALK_PAGE.default) =>
  infiniteQueryOptions({
    queryKey: [...walksQueryKey(fieldId), { pageSize }],
    queryFn: ({ pageParam, signal }) => getWalks({ fieldId }, pageSize, pageParam, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.nextCursor ?? undefined,
    // The pages joined, newest first.
    select: (data) => data.pages.flatMap((page) => page.walks),
  });

export const useWalks = (fieldId: string, pageSize?: number) => useInfiniteQuery(walksQueryOptions(fieldId, pageSize));

/**
 * Every walk the signed-in user may see of one day (`walkedOn`) or a window of days (`from`, `to`), on one field when
 * `fieldId` is given: the server filters the days, the pages are read until none follows.
 */
export const walksOfDaysQueryOptions = ({ fieldId, walkedOn, from, to }: WalksQuery) =>
  queryOptions({
    queryKey: [...walkListsQueryKey, 'days', { fieldId: fieldId ?? null, walkedOn: walkedOn ?? null, from: from ?? null, to: to ?? null }],
    queryFn: ({ signal }) =>
      fetchEveryPage(
        (cursor) => getWalks({ fieldId, walkedOn, from, to }, WALK_PAGE.max, cursor, signal),
        (page) => page.walks,
      ),
  });

export const useWalksOfDays = (query: WalksQuery, enabled = true) => useQuery({ ...walksOfDaysQueryOptions(query), enabled });
