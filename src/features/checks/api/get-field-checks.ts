// GET /api/fields/:id/checks: the field's stored pattern checks, newest first.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FieldChecksResponse } from '@shared/schemas/checks.ts';

export const getFieldChecks = (fieldId: string, pestId?: string) =>
  api<FieldChecksResponse>(`/api/fields/${encodeURIComponent(fieldId)}/checks`, { query: { pestId } }).then((r) => r.checks);
export const fieldChecksQueryKey = (fieldId: string) => ['checks', 'field', fieldId] as const;
export const fieldChecksQueryOptions = (fieldId: string, pestId?: string) =>
  queryOptions({ queryKey: [...fieldChecksQueryKey(fieldId), { pestId: pestId ?? null }], queryFn: () => getFieldChecks(fieldId, pestId) });
export const useFieldChecks = (fieldId: string, pestId?: string) => useQuery(fieldChecksQueryOptions(fieldId, pestId));
