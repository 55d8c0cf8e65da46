// GET /api/sightings for one field: the review page reads a date window of every pest (it filters on the
// client so table, map and export agree), the zone editor one pest's placed sightings. Both need every
// sighting, so the list is read page after page at the largest page size until none follows.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import { fetchEveryPage } from '../every-page.ts';
import { SIGHTING_PAGE, type SightingFilter, type SightingListResponse } from '@shared/schemas/sightings.ts';

export type FieldSightingsQuery = Pick<SightingFilter, 'pestId' | 'from' | 'to' | 'status'> & { fieldId: string };

export const getSightingsPage = (query: FieldSightingsQuery, cursor?: string, signal?: AbortSignal) =>
  api<SightingListResponse>('/api/sightings', { query: { ...query, limit: SIGHTING_PAGE.max, cursor }, signal });
export const getSightings = (query: FieldSightingsQuery, signal?: AbortSignal) =>
  fetchEveryPage(
    (cursor) => getSightingsPage(query, cursor, signal),
    (page) => page.sightings,
  );
/** Every list of one field's sightings (the key's filter object matches partially): what a correction invalidates. */
export const fieldSightingsQueryKey = (fieldId: string) => ['sightings', 'list', { fieldId }] as const;
export const sightingsQueryOptions = ({ fieldId, pestId, from, to, status }: FieldSightingsQuery) =>
  queryOptions({
    queryKey: ['sightings', 'list', { fieldId, pestId: pestId ?? null, from: from ?? null, to: to ?? null, status: status ?? null }],
    queryFn: ({ signal }) => getSightings({ fieldId, pestId, from, to, status }, signal),
  });
export const useSightings = (query: FieldSightingsQuery, enabled = true) => useQuery({ ...sightingsQueryOptions(query), enabled });
