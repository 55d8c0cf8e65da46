import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FarmInput } from '@shared/schemas/farms.ts';
import type { Farm } from '../../../types/api.ts';

export const createFarm = (input: FarmInput) => api<{ farm: Farm }>('/api/farms', { method: 'POST', body: input }).then((r) => r.farm);

export function useCreateFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFarm,
    onSuccess: (farm) => {
      queryClient.setQueryData(['farms', 'detail', farm.id], farm);
      return queryClient.invalidateQueries({ queryKey: ['farms', 'list'] });
    },
  });
}
