// PATCH /api/sightings/:id: pin a photo that had no usable position, or correct its pest or count. The
// scout's walk pages and the adviser's review table both send it.
import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { SightingUpdateInput, SightingView } from '@shared/schemas/sightings.ts';

export const updateSighting = (sightingId: string, change: SightingUpdateInput) =>
  api<{ sighting: SightingView }>(`/api/sightings/${encodeURIComponent(sightingId)}`, { method: 'PATCH', body: change }).then((r) => r.sighting);

/**
 * `shownUnder` is the query that lists the sighting on screen (a walk, a field's sightings): only it is
 * refetched. Stored checks keep the sightings they ran on.
 */
export function useUpdateSighting(shownUnder: QueryKey) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ sightingId, change }: { sightingId: string; change: SightingUpdateInput }) => updateSighting(sightingId, change),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: shownUnder }),
  });
}
