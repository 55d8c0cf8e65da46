// One notice about the grower's own farms, as the notice page shows it; reading it changes nothing.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';

export const growerNoticeQueryKey = (noticeId: string) => ['grower', 'notices', noticeId] as const;
export const getGrowerNotice = (noticeId: string) => api<NoticeLinkResponse>(`/api/grower/notices/${encodeURIComponent(noticeId)}`).then((r) => r.notice);
export const growerNoticeQueryOptions = (noticeId: string) =>
  queryOptions({ queryKey: growerNoticeQueryKey(noticeId), queryFn: () => getGrowerNotice(noticeId) });
export const useGrowerNotice = (noticeId: string) => useQuery(growerNoticeQueryOptions(noticeId));
