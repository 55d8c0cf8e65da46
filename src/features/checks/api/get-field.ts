// GET /api/fields/:id: the field under review (same cache entry as the field page's).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Field } from '../../../types/api.ts';

export const getField = (id: string) => api<{ field: Field }>(`/api/fields/${encodeURIComponent(id)}`).then((r) => r.field);
export const fieldQueryOptions = (id: string) => queryOptions({ queryKey: ['fields', 'detail', id], queryFn: () => getField(id) });
export const useField = (id: string) => useQuery(fieldQueryOptions(id));
