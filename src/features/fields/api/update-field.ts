import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FieldCreateInput } from '@shared/schemas/fields.ts';
import type { Field } from '../../../types/api.ts';

export type FieldChanges = Partial<Omit<FieldCreateInput, 'farmId'>>;

export const updateField = ({ id, ...changes }: FieldChanges & { id: string }) =>
  api<{ field: Field }>(`/api/fields/${id}`, { method: 'PATCH', body: changes }).then((r) => r.field);

export function useUpdateField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateField,
    onSuccess: (field) => {
      queryClient.setQueryData(['fields', 'detail', field.id], field);
      return queryClient.invalidateQueries({ queryKey: ['fields', 'list'] });
    },
  });
}
