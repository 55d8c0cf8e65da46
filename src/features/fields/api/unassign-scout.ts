import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { fieldQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';

export const unassignScout = ({ fieldId, userId }: { fieldId: string; userId: string }) =>
  api<void>(`/api/fields/${fieldId}/scouts/${userId}`, { method: 'DELETE' });

export function useUnassignScout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: unassignScout,
    onSuccess: (_r, { fieldId }) =>
      Promise.all([queryClient.invalidateQueries({ queryKey: fieldQueryKey(fieldId) }), queryClient.invalidateQueries({ queryKey: fieldListsQueryKey })]),
  });
}
