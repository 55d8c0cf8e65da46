import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { PestInput } from '@shared/schemas/pests.ts';
import type { Pest } from '../../../types/api.ts';

export const createPest = (input: PestInput) => api<{ pest: Pest }>('/api/pests', { method: 'POST', body: input }).then((r) => r.pest);

export function useCreatePest() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPest, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['pests'] }) });
}
