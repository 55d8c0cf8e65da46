import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import { usersQueryKey } from './get-users.ts';
import type { inviteUserSchema } from '@shared/schemas/users.ts';
import type { UserView } from '@shared/schemas/users.ts';

export type InviteUserInput = z.infer<typeof inviteUserSchema>;

// `user` is null when the address is taken in another organisation: the server accepts without saying so.
export const inviteUser = (input: InviteUserInput) => api<{ user: UserView | null }>('/api/users', { method: 'POST', body: input }).then((r) => r.user);

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: inviteUser, onSettled: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }) });
}
