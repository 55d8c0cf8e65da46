import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { pestsQueryKey } from '../../../lib/api/get-pests.ts';
import type { PestInput, PestResponse } from '@shared/schemas/pests.ts';

export const updatePest = ({ id, ...changes }: Partial<PestInput> & { id: string }) =>
  api<PestResponse>(`/api/pests/${id}`, { method: 'PATCH', body: changes }).then((r) => r.pest);

export function useUpdatePest() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updatePest, onSuccess: () => queryClient.invalidateQueries({ queryKey: pestsQueryKey }) });
}
