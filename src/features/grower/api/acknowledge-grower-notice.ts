// The signed-in grower acknowledges their own copy; a second press answers with the first one's time.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { AcknowledgeResponse, NoticeLinkResponse } from '@shared/schemas/notices.ts';
import { growerNoticeQueryKey } from './get-grower-notice.ts';
import { growerNoticesQueryOptions } from './get-grower-notices.ts';

export const acknowledgeGrowerNotice = (noticeId: string) =>
  api<AcknowledgeResponse>(`/api/grower/notices/${encodeURIComponent(noticeId)}/acknowledge`, { method: 'POST' });

export function useAcknowledgeGrowerNotice(noticeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acknowledgeGrowerNotice(noticeId),
    onSuccess: ({ acknowledgedAt }) => {
      queryClient.setQueryData<NoticeLinkResponse['notice']>(growerNoticeQueryKey(noticeId), (notice) => (notice ? { ...notice, acknowledgedAt } : notice));
      // The home's list shows this copy's state.
      return queryClient.invalidateQueries({ queryKey: growerNoticesQueryOptions().queryKey, exact: true });
    },
  });
}
