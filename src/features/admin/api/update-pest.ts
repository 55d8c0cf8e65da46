import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { PestInput } from '@shared/schemas/pests.ts';
import type { Pest } from '../../../types/api.ts';

export const updatePest = ({ id, ...changes }: Partial<PestInput> & { id: string }) =>
  api<{ pest: Pest }>(`/api/pests/${id}`, { method: 'PATCH', body: changes }).then((r) => r.pest);

export function useUpdatePest() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updatePest, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['pests'] }) });
}
