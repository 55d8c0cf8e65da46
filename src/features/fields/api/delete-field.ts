import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { fieldQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';

export const deleteField = (id: string) => api<void>(`/api/fields/${encodeURIComponent(id)}`, { method: 'DELETE' });

export function useDeleteField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteField,
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: fieldQueryKey(id) });
      return queryClient.invalidateQueries({ queryKey: fieldListsQueryKey });
    },
  });
}
