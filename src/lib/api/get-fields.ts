// GET /api/fields: the fields the signed-in person may see (the server scopes it by role: a grower's own
// farms, a scout's assigned fields), optionally one farm's only. Admin, adviser, scout and grower pages read it.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { FieldListResponse } from '@shared/schemas/fields.ts';

export const getFields = (farmId?: string) => api<FieldListResponse>('/api/fields', { query: { farmId } }).then((r) => r.fields);
/** Every list of fields: what a change to any field invalidates. */
export const fieldListsQueryKey = ['fields', 'list'] as const;
export const fieldsQueryOptions = (farmId?: string) =>
  queryOptions({ queryKey: [...fieldListsQueryKey, { farmId: farmId ?? null }], queryFn: () => getFields(farmId) });
export const useFields = (farmId?: string) => useQuery(fieldsQueryOptions(farmId));
