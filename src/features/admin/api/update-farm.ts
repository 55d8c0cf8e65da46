import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FarmInput } from '@shared/schemas/farms.ts';
import type { Farm } from '../../../types/api.ts';

/** Sends the whole farm: the server replaces the contact list as a set. */
export const updateFarm = ({ id, ...input }: FarmInput & { id: string }) =>
  api<{ farm: Farm }>(`/api/farms/${id}`, { method: 'PUT', body: input }).then((r) => r.farm);

export function useUpdateFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateFarm,
    onSuccess: (farm) => {
      queryClient.setQueryData(['farms', 'detail', farm.id], farm);
      // Field answers carry the farm's name.
      return Promise.all([queryClient.invalidateQueries({ queryKey: ['farms', 'list'] }), queryClient.invalidateQueries({ queryKey: ['fields'] })]);
    },
  });
}
