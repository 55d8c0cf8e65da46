// The accepted zones a notice is written from.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { ZoneSetResponse } from '@shared/schemas/zones.ts';

export const getNoticeZoneSet = (id: string) => api<ZoneSetResponse>(`/api/zone-sets/${id}`).then((r) => r.zoneSet);
// Same key as the zone editor's detail query: one cached copy of a version.
export const noticeZoneSetQueryOptions = (id: string) => queryOptions({ queryKey: ['zone-sets', 'detail', id], queryFn: () => getNoticeZoneSet(id) });
export const useNoticeZoneSet = (id: string | null) => useQuery({ ...noticeZoneSetQueryOptions(id ?? ''), enabled: Boolean(id) });
