import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { mailMessagesQueryKey } from './get-mail-messages.ts';
import type { UserResponse } from '@shared/schemas/users.ts';

export const resendInvitation = (id: string) => api<UserResponse>(`/api/users/${id}/invitation`, { method: 'POST' }).then((r) => r.user);

/** The new message lands in the mailbox, so that list is the one to refresh. */
export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resendInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: mailMessagesQueryKey }) });
}
