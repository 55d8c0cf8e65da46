import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { UserView } from '@shared/schemas/users.ts';

export const setPassword = (input: { token: string; password: string }) =>
  api<{ user: UserView; message: string }>('/api/auth/set-password', { method: 'POST', body: input });
export const useSetPassword = () => useMutation({ mutationFn: setPassword });
