import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { farmQueryKey } from './get-farm.ts';

export const unlinkGrower = ({ farmId, userId }: { farmId: string; userId: string }) =>
  api<void>(`/api/farms/${farmId}/growers/${userId}`, { method: 'DELETE' });

export function useUnlinkGrower() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: unlinkGrower, onSuccess: (_r, { farmId }) => queryClient.invalidateQueries({ queryKey: farmQueryKey(farmId) }) });
}
