import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Field } from '../../../types/api.ts';

/** The fields the signed-in person may see (the server scopes it by role), optionally one farm's only. */
export const getFields = (farmId?: string) => api<{ fields: Field[] }>('/api/fields', { query: { farmId } }).then((r) => r.fields);
export const fieldsQueryOptions = (farmId?: string) => queryOptions({ queryKey: ['fields', 'list', { farmId: farmId ?? null }], queryFn: () => getFields(farmId) });
export const useFields = (farmId?: string) => useQuery(fieldsQueryOptions(farmId));
