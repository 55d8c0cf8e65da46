// The grower's notice page reports, once, that the grower opened their own copy (the GET itself records nothing).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { OpenedResponse } from '@shared/schemas/notices.ts';
import { growerNoticesQueryOptions } from './get-grower-notices.ts';

export const reportGrowerNoticeOpened = (noticeId: string) =>
  api<OpenedResponse>(`/api/grower/notices/${encodeURIComponent(noticeId)}/opened`, { method: 'POST' });

export function useReportGrowerNoticeOpened(noticeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => reportGrowerNoticeOpened(noticeId),
    // The home's list shows this copy's state.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: growerNoticesQueryOptions().queryKey, exact: true }),
  });
}
