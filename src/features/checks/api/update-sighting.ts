// PATCH /api/sightings/:id from the review table: correct a sighting's pest or count.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { SightingUpdateInput, SightingView } from '@shared/schemas/sightings.ts';
import { fieldSightingsQueryKey } from './get-field-sightings.ts';

export const updateSighting = (sightingId: string, change: SightingUpdateInput) =>
  api<{ sighting: SightingView }>(`/api/sightings/${encodeURIComponent(sightingId)}`, { method: 'PATCH', body: change }).then((r) => r.sighting);

/** Only the field's sightings lists change; stored checks keep the sightings they ran on. */
export function useUpdateSighting(fieldId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ sightingId, change }: { sightingId: string; change: SightingUpdateInput }) => updateSighting(sightingId, change),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fieldSightingsQueryKey(fieldId) }),
  });
}
