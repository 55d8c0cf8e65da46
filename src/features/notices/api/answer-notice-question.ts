// The adviser's answer to a grower's question; the server e-mails it to the grower.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { AdviserNoticeQuestionView } from '@shared/schemas/notice-questions.ts';
import { noticeQuestionsQueryKey } from './get-notice-questions.ts';

export const answerNoticeQuestion = (noticeId: string, questionId: string, text: string) =>
  api<{ question: AdviserNoticeQuestionView; growerMailed: boolean }>(`/api/notices/${noticeId}/questions/${questionId}/answer`, {
    method: 'POST',
    body: { text },
  });

export function useAnswerNoticeQuestion(noticeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ questionId, text }: { questionId: string; text: string }) => answerNoticeQuestion(noticeId, questionId, text),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: noticeQuestionsQueryKey(noticeId), exact: true }),
  });
}
