import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { pestsQueryKey } from '../../../lib/api/get-pests.ts';
import type { PestInput, PestResponse } from '@shared/schemas/pests.ts';

export const createPest = (input: PestInput) => api<PestResponse>('/api/pests', { method: 'POST', body: input }).then((r) => r.pest);

export function useCreatePest() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createPest, onSuccess: () => queryClient.invalidateQueries({ queryKey: pestsQueryKey }) });
}
