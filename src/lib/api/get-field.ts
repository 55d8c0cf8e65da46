// GET /api/fields/:id: one field with its boundary. The field page, the review page, the zone editor and the
// scout's walk pages read it, so it lives here: one fetcher, one cache entry per field.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { FieldResponse } from '@shared/schemas/fields.ts';

export const getField = (id: string) => api<FieldResponse>(`/api/fields/${encodeURIComponent(id)}`).then((r) => r.field);
/** Every cached field: what a change that shows in every field's answer (a farm's name) invalidates. */
export const fieldDetailsQueryKey = ['fields', 'detail'] as const;
export const fieldQueryKey = (id: string) => [...fieldDetailsQueryKey, id] as const;
export const fieldQueryOptions = (id: string) => queryOptions({ queryKey: fieldQueryKey(id), queryFn: () => getField(id) });
export const useField = (id: string) => useQuery(fieldQueryOptions(id));
