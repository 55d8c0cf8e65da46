// GET /api/sightings for one field and date window: every pest, empty stops included; the review page
// filters pest, scout, walk and date on the client so the table, map and export agree.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { SightingListResponse } from '@shared/schemas/sightings.ts';

export interface SightingWindow {
  fieldId: string;
  from?: string;
  to?: string;
}

export const getFieldSightings = ({ fieldId, from, to }: SightingWindow) =>
  api<SightingListResponse>('/api/sightings', { query: { fieldId, from, to, status: 'placed' } }).then((r) => r.sightings);

export const fieldSightingsQueryKey = (fieldId: string) => ['sightings', 'list', { fieldId }] as const;

export const fieldSightingsQueryOptions = (window: SightingWindow) =>
  queryOptions({ queryKey: [...fieldSightingsQueryKey(window.fieldId), { from: window.from ?? null, to: window.to ?? null }], queryFn: () => getFieldSightings(window) });

export const useFieldSightings = (window: SightingWindow) => useQuery(fieldSightingsQueryOptions(window));
