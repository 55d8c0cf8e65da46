// POST /api/walks/:id/stops: an empty stop ("nothing found here") at the phone's position.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkStopInput } from '@shared/schemas/walks.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { walkQueryKey } from './get-walk.ts';

export const recordStop = (walkId: string, stop: WalkStopInput) =>
  api<{ sighting: SightingView }>(`/api/walks/${encodeURIComponent(walkId)}/stops`, { method: 'POST', body: stop });

export function useRecordStop(walkId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (stop: WalkStopInput) => recordStop(walkId, stop),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: walkQueryKey(walkId) }),
  });
}
