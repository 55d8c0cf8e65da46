import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { farmQueryKey } from './get-farm.ts';

export const linkGrower = ({ farmId, userId }: { farmId: string; userId: string }) =>
  api<void>(`/api/farms/${farmId}/growers`, { method: 'POST', body: { userId } });

export function useLinkGrower() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: linkGrower, onSuccess: (_r, { farmId }) => queryClient.invalidateQueries({ queryKey: farmQueryKey(farmId) }) });
}
