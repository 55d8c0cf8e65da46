// The public notice page's content, opened by the token in the e-mailed link (no session).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';

export type LinkedNotice = NoticeLinkResponse['notice'];

export const getNoticeLink = (token: string) => api<NoticeLinkResponse>(`/api/notice-links/${encodeURIComponent(token)}`).then((r) => r.notice);
export const noticeLinkQueryKey = (token: string) => ['notice-links', token] as const;
export const noticeLinkQueryOptions = (token: string) =>
  queryOptions({ queryKey: noticeLinkQueryKey(token), queryFn: () => getNoticeLink(token), staleTime: Infinity });
export const useNoticeLink = (token: string) => useQuery(noticeLinkQueryOptions(token));
