// GET /api/sightings for one field: the review page reads a date window of every pest (it filters on the
// client so table, map and export agree), the zone editor one pest's placed sightings.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { SightingListQuery, SightingListResponse } from '@shared/schemas/sightings.ts';

export type FieldSightingsQuery = Pick<SightingListQuery, 'pestId' | 'from' | 'to' | 'status'> & { fieldId: string };

export const getSightings = (query: FieldSightingsQuery) => api<SightingListResponse>('/api/sightings', { query }).then((r) => r.sightings);
/** Every list of one field's sightings (the key's filter object matches partially): what a correction invalidates. */
export const fieldSightingsQueryKey = (fieldId: string) => ['sightings', 'list', { fieldId }] as const;
export const sightingsQueryOptions = ({ fieldId, pestId, from, to, status }: FieldSightingsQuery) =>
  queryOptions({
    queryKey: ['sightings', 'list', { fieldId, pestId: pestId ?? null, from: from ?? null, to: to ?? null, status: status ?? null }],
    queryFn: () => getSightings({ fieldId, pestId, from, to, status }),
  });
export const useSightings = (query: FieldSightingsQuery, enabled = true) => useQuery({ ...sightingsQueryOptions(query), enabled });
