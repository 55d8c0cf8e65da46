import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { fieldQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';
import type { FieldCreateInput, FieldResponse } from '@shared/schemas/fields.ts';

export type FieldChanges = Partial<Omit<FieldCreateInput, 'farmId'>>;

export const updateField = ({ id, ...changes }: FieldChanges & { id: string }) =>
  api<FieldResponse>(`/api/fields/${encodeURIComponent(id)}`, { method: 'PATCH', body: changes }).then((r) => r.field);

export function useUpdateField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateField,
    onSuccess: (field) => {
      queryClient.setQueryData(fieldQueryKey(field.id), field);
      return queryClient.invalidateQueries({ queryKey: fieldListsQueryKey });
    },
  });
}
