import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { fieldQueryKey } from '../../../lib/api/get-field.ts';
import { fieldListsQueryKey } from '../../../lib/api/get-fields.ts';
import type { FieldCreateInput, FieldResponse } from '@shared/schemas/fields.ts';

export const createField = (input: FieldCreateInput) => api<FieldResponse>('/api/fields', { method: 'POST', body: input }).then((r) => r.field);

export function useCreateField() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createField,
    onSuccess: (field) => {
      queryClient.setQueryData(fieldQueryKey(field.id), field);
      return queryClient.invalidateQueries({ queryKey: fieldListsQueryKey });
    },
  });
}
