// The field whose boundary frames the zones.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Field } from '../../../types/api.ts';

export const getZoneField = (id: string) => api<{ field: Field }>(`/api/fields/${id}`).then((r) => r.field);
// Same key as the fields feature's detail query: one cached copy of the field.
export const zoneFieldQueryOptions = (id: string) => queryOptions({ queryKey: ['fields', 'detail', id], queryFn: () => getZoneField(id) });
export const useZoneField = (id: string) => useQuery(zoneFieldQueryOptions(id));
