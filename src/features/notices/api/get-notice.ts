// One notice with each recipient's copy; refreshed every few seconds while a copy may still go out.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeResponse, NoticeView } from '@shared/schemas/notices.ts';

const REFRESH_MS = 2000;

/** A copy is still on its way while queued or sending (a failed copy may be retried by the queue too). */
export const isStillSending = (notice: NoticeView) =>
  notice.status === 'sending' || notice.recipients.some((r) => r.delivery === 'queued' || r.delivery === 'sending');

export const noticeQueryKey = (id: string) => ['notices', 'detail', id] as const;
export const getNotice = (id: string) => api<NoticeResponse>(`/api/notices/${id}`).then((r) => r.notice);
export const noticeQueryOptions = (id: string) =>
  queryOptions({
    queryKey: noticeQueryKey(id),
    queryFn: () => getNotice(id),
    refetchInterval: (query) => (query.state.data && isStillSending(query.state.data) ? REFRESH_MS : false),
  });
export const useNotice = (id: string) => useQuery(noticeQueryOptions(id));
