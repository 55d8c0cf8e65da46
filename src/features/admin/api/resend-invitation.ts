import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { User } from '../../../types/api.ts';

export const resendInvitation = (id: string) => api<{ user: User }>(`/api/users/${id}/invitation`, { method: 'POST' }).then((r) => r.user);

/** The new message lands in the mailbox, so that list is the one to refresh. */
export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resendInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['mailbox', 'list'] }) });
}
