import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

export const deleteField = (id: string) => api<void>(`/api/fields/${id}`, { method: 'DELETE' });

export function useDeleteField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteField,
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: ['fields', 'detail', id] });
      return queryClient.invalidateQueries({ queryKey: ['fields', 'list'] });
    },
  });
}
