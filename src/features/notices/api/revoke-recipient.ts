// Withdraws one recipient's notice link (an unsent copy is then not sent).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { noticeQueryKey } from './get-notice.ts';
import type { NoticeResponse } from '@shared/schemas/notices.ts';

export const revokeRecipient = ({ noticeId, recipientId }: { noticeId: string; recipientId: string }) =>
  api<NoticeResponse>(`/api/notices/${noticeId}/recipients/${recipientId}/revoke`, { method: 'POST' }).then((r) => r.notice);

export function useRevokeRecipient() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeRecipient,
    onSuccess: (notice) => queryClient.setQueryData(noticeQueryKey(notice.id), notice),
  });
}
