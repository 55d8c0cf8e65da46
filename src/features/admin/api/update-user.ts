import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import { usersQueryKey } from './get-users.ts';
import type { updateUserSchema } from '@shared/schemas/users.ts';
import type { UserResponse } from '@shared/schemas/users.ts';

export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const updateUser = ({ id, ...changes }: UpdateUserInput & { id: string }) =>
  api<UserResponse>(`/api/users/${id}`, { method: 'PATCH', body: changes }).then((r) => r.user);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateUser, onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }) });
}
