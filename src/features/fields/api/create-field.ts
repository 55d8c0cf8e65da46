import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FieldCreateInput } from '@shared/schemas/fields.ts';
import type { Field } from '../../../types/api.ts';

export const createField = (input: FieldCreateInput) => api<{ field: Field }>('/api/fields', { method: 'POST', body: input }).then((r) => r.field);

export function useCreateField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createField,
    onSuccess: (field) => {
      queryClient.setQueryData(['fields', 'detail', field.id], field);
      return queryClient.invalidateQueries({ queryKey: ['fields', 'list'] });
    },
  });
}
