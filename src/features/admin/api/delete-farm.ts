import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

/** The server refuses a farm that still has fields (409), naming how many. */
export const deleteFarm = (id: string) => api<void>(`/api/farms/${id}`, { method: 'DELETE' });

export function useDeleteFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteFarm,
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: ['farms', 'detail', id] });
      return queryClient.invalidateQueries({ queryKey: ['farms', 'list'] });
    },
  });
}
