// GET /api/fields/:id/threshold-status: each walk's mean per stop (or share infested) against the pest's threshold.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { ThresholdStatusResponse } from '@shared/schemas/checks.ts';

export const getThresholdStatus = (fieldId: string, pestId?: string) =>
  api<ThresholdStatusResponse>(`/api/fields/${encodeURIComponent(fieldId)}/threshold-status`, { query: { pestId } }).then((r) => r.statuses);
export const thresholdStatusQueryOptions = (fieldId: string, pestId?: string) =>
  queryOptions({ queryKey: ['fields', 'threshold-status', fieldId, { pestId: pestId ?? null }], queryFn: () => getThresholdStatus(fieldId, pestId) });
export const useThresholdStatus = (fieldId: string, pestId?: string) => useQuery(thresholdStatusQueryOptions(fieldId, pestId));
