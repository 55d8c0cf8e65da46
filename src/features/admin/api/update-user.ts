import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { updateUserSchema } from '@shared/schemas/users.ts';
import type { User } from '../../../types/api.ts';

export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const updateUser = ({ id, ...changes }: UpdateUserInput & { id: string }) =>
  api<{ user: User }>(`/api/users/${id}`, { method: 'PATCH', body: changes }).then((r) => r.user);

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateUser, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['users'] }) });
}
