import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkView } from '@shared/schemas/walks.ts';
import { walkListsQueryKey } from '../../../lib/api/get-walks.ts';
import { walkQueryKey } from './get-walk.ts';

/** Marks the walk finished; finishing it again answers the walk with its first finish time. */
export const finishWalk = (walkId: string) => api<{ walk: WalkView }>(`/api/walks/${encodeURIComponent(walkId)}/finish`, { method: 'POST', body: {} });

export function useFinishWalk(walkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => finishWalk(walkId),
    // The walk (and its summary, under the same key) and the field lists that show the finished mark.
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: walkQueryKey(walkId) }), queryClient.invalidateQueries({ queryKey: walkListsQueryKey })]),
  });
}
