// The pattern check behind a zone proposal: its field, pest and state (the checks feature shows the rest).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckView } from '@shared/schemas/checks.ts';

export const getZoneCheck = (id: string) => api<{ check: CheckView }>(`/api/checks/${id}`).then((r) => r.check);
// Same key as the checks feature's detail query, so both read one cached copy.
export const zoneCheckQueryOptions = (id: string) => queryOptions({ queryKey: ['checks', 'detail', id], queryFn: () => getZoneCheck(id) });
export const useZoneCheck = (id: string | null) => useQuery({ ...zoneCheckQueryOptions(id ?? ''), enabled: Boolean(id) });
