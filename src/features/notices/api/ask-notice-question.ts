// The grower's question or comment from the e-mailed link's page; the answer shows on the page once given.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeQuestionResponse } from '@shared/schemas/notice-questions.ts';
import { noticeLinkQueryKey, type LinkedNotice } from './get-notice-link.ts';

export const askNoticeQuestion = (token: string, text: string) =>
  api<NoticeQuestionResponse>(`/api/notice-links/${encodeURIComponent(token)}/questions`, { method: 'POST', body: { text } });

export function useAskNoticeQuestion(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (text: string) => askNoticeQuestion(token, text),
    onSuccess: ({ question }) =>
      queryClient.setQueryData<LinkedNotice>(noticeLinkQueryKey(token), (notice) =>
        notice ? { ...notice, questions: [...notice.questions, question] } : notice,
      ),
  });
}
