import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client.ts';
import { meQueryKey } from '../../../lib/query-client.ts';
import type { UserView } from '@shared/schemas/users.ts';

export const signIn = (input: { email: string; password: string }) =>
  api<{ user: UserView; csrfToken: string }>('/api/auth/sign-in', { method: 'POST', body: input });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user, csrfToken }) => {
      // The session id changed at sign-in, and the CSRF token with it.
      setCsrfToken(csrfToken);
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
      queryClient.setQueryData(meQueryKey, { user });
    },
  });
}
