import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { User } from '../../../types/api.ts';

export const setPassword = (input: { token: string; password: string }) =>
  api<{ user: User; message: string }>('/api/auth/set-password', { method: 'POST', body: input });
export const useSetPassword = () => useMutation({ mutationFn: setPassword });
