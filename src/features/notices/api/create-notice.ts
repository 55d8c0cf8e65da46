// Saving the adviser's recommendation as a draft notice for one accepted zone set.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { noticeQueryKey } from './get-notice.ts';
import { noticeListsQueryKey } from '../../../lib/api/get-notices.ts';
import type { NoticeCreateRequest, NoticeResponse } from '@shared/schemas/notices.ts';

export const createNotice = (request: NoticeCreateRequest) => api<NoticeResponse>('/api/notices', { method: 'POST', body: request }).then((r) => r.notice);

export function useCreateNotice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createNotice,
    onSuccess: (notice) => {
      queryClient.setQueryData(noticeQueryKey(notice.id), notice);
      return queryClient.invalidateQueries({ queryKey: noticeListsQueryKey });
    },
  });
}
