// GET /api/advisers/attention: the fields that need the adviser now.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { AttentionResponse } from '@shared/schemas/checks.ts';

export const getAttention = () => api<AttentionResponse>('/api/advisers/attention');
export const attentionQueryOptions = () => queryOptions({ queryKey: ['advisers', 'attention'], queryFn: getAttention });
export const useAttention = () => useQuery(attentionQueryOptions());
