// POST /api/checks: run a pattern check (or get the stored one with the same inputs). 201 computed now,
// 200 stored, 202 queued: the check's own query then polls until it is done.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckRequestInput, CheckResponse } from '@shared/schemas/checks.ts';
import { checkQueryKey } from '../../../lib/api/get-check.ts';
import { fieldHistoryQueryKey } from './get-field-history.ts';
import { fieldChecksQueryKey } from '../../../lib/api/get-field-checks.ts';

export const runCheck = (request: CheckRequestInput) => api<CheckResponse>('/api/checks', { method: 'POST', body: request }).then((r) => r.check);

export function useRunCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runCheck,
    onSuccess: (check) => {
      queryClient.setQueryData(checkQueryKey(check.id), check);
      // A new stored check appears in the field's history and in its list of past checks.
      if (!check.reused) {
        void queryClient.invalidateQueries({ queryKey: fieldHistoryQueryKey(check.fieldId) });
        void queryClient.invalidateQueries({ queryKey: fieldChecksQueryKey(check.fieldId) });
      }
    },
  });
}
