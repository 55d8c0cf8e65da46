// The grower's acknowledgement; a second one answers with the first one's time.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { AcknowledgeResponse } from '@shared/schemas/notices.ts';
import { noticeLinkQueryKey, type LinkedNotice } from './get-notice-link.ts';

export const acknowledgeNotice = (token: string) => api<AcknowledgeResponse>(`/api/notice-links/${encodeURIComponent(token)}/acknowledge`, { method: 'POST' });

export function useAcknowledgeNotice(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acknowledgeNotice(token),
    onSuccess: ({ acknowledgedAt }) =>
      queryClient.setQueryData<LinkedNotice>(noticeLinkQueryKey(token), (notice) => (notice ? { ...notice, acknowledgedAt } : notice)),
  });
}
