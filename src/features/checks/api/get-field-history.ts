// GET /api/fields/:id/history: the season's walks with sightings and mean counts per pest, and past checks.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { FieldHistoryResponse } from '@shared/schemas/checks.ts';

export const getFieldHistory = (fieldId: string, pestId?: string) =>
  api<FieldHistoryResponse>(`/api/fields/${encodeURIComponent(fieldId)}/history`, { query: { pestId } });
export const fieldHistoryQueryKey = (fieldId: string) => ['fields', 'history', fieldId] as const;
export const fieldHistoryQueryOptions = (fieldId: string, pestId?: string) =>
  queryOptions({ queryKey: [...fieldHistoryQueryKey(fieldId), { pestId: pestId ?? null }], queryFn: () => getFieldHistory(fieldId, pestId) });
export const useFieldHistory = (fieldId: string, pestId?: string) => useQuery(fieldHistoryQueryOptions(fieldId, pestId));
