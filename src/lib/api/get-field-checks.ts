// GET /api/fields/:id/checks: a field's stored checks, newest first, as summary rows (no figures). The review
// page lists and compares them; the field page shows the latest.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { FieldChecksResponse } from '@shared/schemas/checks.ts';

export const getFieldChecks = (fieldId: string, pestId?: string) =>
  api<FieldChecksResponse>(`/api/fields/${encodeURIComponent(fieldId)}/checks`, { query: { pestId } }).then((r) => r.checks);
/** Every list of the field's checks (any pest): what a newly stored check invalidates. */
export const fieldChecksQueryKey = (fieldId: string) => ['fields', 'checks', fieldId] as const;
export const fieldChecksQueryOptions = (fieldId: string, pestId?: string) =>
  queryOptions({ queryKey: [...fieldChecksQueryKey(fieldId), { pestId: pestId ?? null }], queryFn: () => getFieldChecks(fieldId, pestId) });
export const useFieldChecks = (fieldId: string, pestId?: string, options: { enabled?: boolean } = {}) =>
  useQuery({ ...fieldChecksQueryOptions(fieldId, pestId), enabled: options.enabled ?? true });
