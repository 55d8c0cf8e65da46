import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { fieldQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';

export const assignScout = ({ fieldId, userId }: { fieldId: string; userId: string }) =>
  api<void>(`/api/fields/${fieldId}/scouts`, { method: 'POST', body: { userId } });

export function useAssignScout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: assignScout,
    onSuccess: (_r, { fieldId }) =>
      Promise.all([queryClient.invalidateQueries({ queryKey: fieldQueryKey(fieldId) }), queryClient.invalidateQueries({ queryKey: fieldListsQueryKey })]),
  });
}
