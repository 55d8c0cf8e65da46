// Queues one copy per chosen recipient (or the copies that failed, on a re-send).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { noticeQueryKey } from './get-notice.ts';
import { noticeListsQueryKey } from '../../../lib/api/get-notices.ts';
import type { NoticeRecipientChoice, NoticeResponse } from '@shared/schemas/notices.ts';

export const sendNotice = ({ id, recipients }: { id: string; recipients?: NoticeRecipientChoice }) =>
  api<NoticeResponse>(`/api/notices/${id}/send`, { method: 'POST', body: recipients ? { recipients } : {} }).then((r) => r.notice);

export function useSendNotice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: sendNotice,
    onSuccess: (notice) => {
      queryClient.setQueryData(noticeQueryKey(notice.id), notice);
      return queryClient.invalidateQueries({ queryKey: noticeListsQueryKey });
    },
  });
}
