import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import { usersQueryKey } from './get-users.ts';
import type { inviteUserSchema } from '@shared/schemas/users.ts';

export type InviteUserInput = z.infer<typeof inviteUserSchema>;

// One answer whether or not the address is taken in another organisation: the server does not say which.
export const inviteUser = (input: InviteUserInput) => api<{ message: string }>('/api/users', { method: 'POST', body: input });

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: inviteUser, onSettled: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }) });
}
