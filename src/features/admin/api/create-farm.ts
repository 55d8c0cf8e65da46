import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { farmsQueryKey } from '../../../lib/api/get-farms.ts';
import type { FarmInput, FarmResponse } from '@shared/schemas/farms.ts';
import { farmQueryKey } from './get-farm.ts';

export const createFarm = (input: FarmInput) => api<FarmResponse>('/api/farms', { method: 'POST', body: input }).then((r) => r.farm);

export function useCreateFarm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFarm,
    onSuccess: (farm) => {
      queryClient.setQueryData(farmQueryKey(farm.id), farm);
      return queryClient.invalidateQueries({ queryKey: farmsQueryKey });
    },
  });
}
