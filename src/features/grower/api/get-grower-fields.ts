// The fields of the grower's farms (the server scopes the list to the farms linked to the account).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Field } from '../../../types/api.ts';

export const getGrowerFields = () => api<{ fields: Field[] }>('/api/fields').then((r) => r.fields);
// Same key as the fields feature's unfiltered list: one cached copy.
export const growerFieldsQueryOptions = () => queryOptions({ queryKey: ['fields', 'list', { farmId: null }], queryFn: getGrowerFields });
export const useGrowerFields = () => useQuery(growerFieldsQueryOptions());
