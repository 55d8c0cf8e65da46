// GET /api/notices/overview: every notice of the organisation with each copy's state, filtered, a page at a time.
import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { noticeListsQueryKey } from '../../../lib/api/get-notices.ts';
import type { NoticeListPage, NoticeListState } from '@shared/schemas/notices.ts';

export interface NoticeOverviewFilter {
  farmId?: string;
  fieldId?: string;
  state?: NoticeListState;
  /** ISO instants: the notice's date on or after `from`, before `before`. */
  from?: string;
  before?: string;
}

export const getNoticeOverview = (filter: NoticeOverviewFilter, cursor?: string) =>
  api<NoticeListPage>('/api/notices/overview', { query: { ...filter, cursor } });

// Under the notice lists' key, so a new or sent notice refreshes this list too.
export const noticeOverviewQueryOptions = (filter: NoticeOverviewFilter) =>
  infiniteQueryOptions({
    queryKey: [...noticeListsQueryKey, 'overview', filter],
    queryFn: ({ pageParam }) => getNoticeOverview(filter, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.nextCursor ?? undefined,
  });
/** `enabled` false holds the request back (the page waits for the organisation's time zone before asking by day). */
export const useNoticeOverview = (filter: NoticeOverviewFilter, enabled = true) => useInfiniteQuery({ ...noticeOverviewQueryOptions(filter), enabled });
