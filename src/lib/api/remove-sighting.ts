// DELETE /api/sightings/:id and POST /api/sightings/:id/restore: a wrong sighting is removed softly and can be
// brought back. `shownUnder` is the query that lists it on screen; only it is refetched.
import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';

export const removeSighting = (sightingId: string) => api<void>(`/api/sightings/${encodeURIComponent(sightingId)}`, { method: 'DELETE' });

export const restoreSighting = (sightingId: string) =>
  api<{ sighting: SightingView }>(`/api/sightings/${encodeURIComponent(sightingId)}/restore`, { method: 'POST' }).then((r) => r.sighting);

export function useRemoveSighting(shownUnder: QueryKey) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: removeSighting, onSuccess: () => queryClient.invalidateQueries({ queryKey: shownUnder }) });
}

export function useRestoreSighting(shownUnder: QueryKey) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: restoreSighting, onSuccess: () => queryClient.invalidateQueries({ queryKey: shownUnder }) });
}
