// The signed-in grower's question or comment on a notice of their farm.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';
import type { NoticeQuestionResponse } from '@shared/schemas/notice-questions.ts';
import { growerNoticeQueryKey } from './get-grower-notice.ts';

export const askGrowerNoticeQuestion = (noticeId: string, text: string) =>
  api<NoticeQuestionResponse>(`/api/grower/notices/${encodeURIComponent(noticeId)}/questions`, { method: 'POST', body: { text } });

export function useAskGrowerNoticeQuestion(noticeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (text: string) => askGrowerNoticeQuestion(noticeId, text),
    onSuccess: ({ question }) =>
      queryClient.setQueryData<NoticeLinkResponse['notice']>(growerNoticeQueryKey(noticeId), (notice) =>
        notice ? { ...notice, questions: [...notice.questions, question] } : notice,
      ),
  });
}
