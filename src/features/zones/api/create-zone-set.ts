// Accepting zones stores them as the field's next version for the pest (the previous one is superseded).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { zoneSetQueryKey } from '../../../lib/api/get-zone-set.ts';
import type { ZoneSetCreateRequest, ZoneSetResponse } from '@shared/schemas/zones.ts';
import { zoneSetsQueryKey } from '../../../lib/api/get-zone-sets.ts';

export const createZoneSet = ({ fieldId, ...request }: ZoneSetCreateRequest & { fieldId: string }) =>
  api<ZoneSetResponse>(`/api/fields/${fieldId}/zone-sets`, { method: 'POST', body: request });

export function useCreateZoneSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createZoneSet,
    onSuccess: ({ zoneSet }) => {
      queryClient.setQueryData(zoneSetQueryKey(zoneSet.id), zoneSet);
      return queryClient.invalidateQueries({ queryKey: zoneSetsQueryKey(zoneSet.fieldId) });
    },
  });
}
