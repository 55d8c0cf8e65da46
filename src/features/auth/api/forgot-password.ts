import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

export const requestPasswordReset = (input: { email: string }) => api<{ message: string }>('/api/auth/forgot-password', { method: 'POST', body: input });
export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
