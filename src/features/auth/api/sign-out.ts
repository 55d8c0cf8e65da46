import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client.ts';
import { meQueryKey } from '../../../lib/query-client.ts';
import { forgetOfflineReads } from '../../../lib/offline-reads.ts';

export const signOut = () => api<void>('/api/auth/sign-out', { method: 'POST' });

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      setCsrfToken(null);
      // Nothing of the last person's data stays in memory.
      queryClient.clear();
      queryClient.setQueryData(meQueryKey, { user: null });
      void forgetOfflineReads();
    },
  });
}
