import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { farmsQueryKey } from '../../../lib/api/get-farms.ts';
import { fieldDetailsQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';
import type { FarmInput, FarmResponse } from '@shared/schemas/farms.ts';
import { farmQueryKey } from './get-farm.ts';

/** Sends the whole farm: the server replaces the contact list as a set. */
export const updateFarm = ({ id, ...input }: FarmInput & { id: string }) =>
  api<FarmResponse>(`/api/farms/${encodeURIComponent(id)}`, { method: 'PUT', body: input }).then((r) => r.farm);

export function useUpdateFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateFarm,
    onSuccess: (farm) => {
      queryClient.setQueryData(farmQueryKey(farm.id), farm);
      // Field answers carry the farm's name.
      return Promise.all([farmsQueryKey, fieldDetailsQueryKey, fieldListsQueryKey].map((queryKey) => queryClient.invalidateQueries({ queryKey })));
    },
  });
}
