import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkUpdateInput, WalkView } from '@shared/schemas/walks.ts';
import { walkQueryKey } from './get-walk.ts';
import { walksQueryKey } from '../../../lib/api/get-walks.ts';

export const updateWalk = (walkId: string, input: WalkUpdateInput) =>
  api<{ walk: WalkView }>(`/api/walks/${encodeURIComponent(walkId)}`, { method: 'PATCH', body: input });

export function useUpdateWalk(walkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: WalkUpdateInput) => updateWalk(walkId, input),
    onSuccess: ({ walk }) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: walkQueryKey(walkId) }),
        queryClient.invalidateQueries({ queryKey: walksQueryKey(walk.fieldId) }),
      ]),
  });
}
