// GET /api/zone-sets/:id: one stored zone version with its zones and the server's figures. The zone editor
// and the notice composer read it.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { ZoneSetResponse } from '@shared/schemas/zones.ts';

export const getZoneSet = (id: string) => api<ZoneSetResponse>(`/api/zone-sets/${encodeURIComponent(id)}`).then((r) => r.zoneSet);
export const zoneSetQueryKey = (id: string) => ['zone-sets', 'detail', id] as const;
export const zoneSetQueryOptions = (id: string) => queryOptions({ queryKey: zoneSetQueryKey(id), queryFn: () => getZoneSet(id) });
export const useZoneSet = (id: string | null) => useQuery({ ...zoneSetQueryOptions(id ?? ''), enabled: Boolean(id) });
