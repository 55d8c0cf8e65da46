import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { farmsQueryKey } from '../../../lib/api/get-farms.ts';
import { farmQueryKey } from './get-farm.ts';

/** The server refuses a farm that still has fields (409), naming how many. */
export const deleteFarm = (id: string) => api<void>(`/api/farms/${encodeURIComponent(id)}`, { method: 'DELETE' });

export function useDeleteFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteFarm,
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: farmQueryKey(id) });
      return queryClient.invalidateQueries({ queryKey: farmsQueryKey });
    },
  });
}
