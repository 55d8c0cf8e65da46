// A field's accepted zone versions, newest first as the server lists them.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { ZoneSetListResponse } from '@shared/schemas/zones.ts';

export const getZoneSets = (fieldId: string) => api<ZoneSetListResponse>(`/api/fields/${fieldId}/zone-sets`).then((r) => r.zoneSets);
export const zoneSetsQueryKey = (fieldId: string) => ['zone-sets', 'list', fieldId] as const;
export const zoneSetsQueryOptions = (fieldId: string) => queryOptions({ queryKey: zoneSetsQueryKey(fieldId), queryFn: () => getZoneSets(fieldId) });
export const useZoneSets = (fieldId: string) => useQuery(zoneSetsQueryOptions(fieldId));

/** Where a version downloads as a file (the server names it). */
export const zoneSetExportUrl = (zoneSetId: string, format: 'geojson' | 'kml' | 'taskdata.zip' | 'shp.zip') => `/api/zone-sets/${zoneSetId}/export.${format}`;
