import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkCreateInput, WalkView } from '@shared/schemas/walks.ts';
import { walksQueryKey } from '../../../lib/api/get-walks.ts';

export const createWalk = (input: WalkCreateInput) => api<{ walk: WalkView }>('/api/walks', { method: 'POST', body: input });

export function useCreateWalk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWalk,
    onSuccess: ({ walk }) => queryClient.invalidateQueries({ queryKey: walksQueryKey(walk.fieldId) }),
  });
}
