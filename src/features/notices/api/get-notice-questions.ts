// The growers' questions on one notice, for the adviser, oldest first.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeQuestionsResponse } from '@shared/schemas/notice-questions.ts';
import { noticeQueryKey } from './get-notice.ts';

export const noticeQuestionsQueryKey = (noticeId: string) => [...noticeQueryKey(noticeId), 'questions'] as const;
export const getNoticeQuestions = (noticeId: string) => api<NoticeQuestionsResponse>(`/api/notices/${noticeId}/questions`).then((r) => r.questions);
export const noticeQuestionsQueryOptions = (noticeId: string) =>
  queryOptions({ queryKey: noticeQuestionsQueryKey(noticeId), queryFn: () => getNoticeQuestions(noticeId) });
export const useNoticeQuestions = (noticeId: string) => useQuery(noticeQuestionsQueryOptions(noticeId));
