// One stored zone version with its zones and the server's figures.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { ZoneSetResponse } from '@shared/schemas/zones.ts';

export const getZoneSet = (id: string) => api<ZoneSetResponse>(`/api/zone-sets/${id}`).then((r) => r.zoneSet);
export const zoneSetQueryOptions = (id: string) => queryOptions({ queryKey: ['zone-sets', 'detail', id], queryFn: () => getZoneSet(id) });
export const useZoneSet = (id: string | null) => useQuery({ ...zoneSetQueryOptions(id ?? ''), enabled: Boolean(id) });
