import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkDetailResponse } from '@shared/schemas/sightings.ts';

export const getWalk = (walkId: string) => api<WalkDetailResponse>(`/api/walks/${encodeURIComponent(walkId)}`);

export const walkQueryKey = (walkId: string) => ['walks', 'detail', walkId] as const;

// Thumbnails are made by a background job: while any is pending, ask again every few seconds.
const THUMBNAIL_POLL_MS = 3000;

export const walkQueryOptions = (walkId: string) =>
  queryOptions({
    queryKey: walkQueryKey(walkId),
    queryFn: () => getWalk(walkId),
    refetchInterval: (query) => (query.state.data?.sightings.some((s) => s.thumbnailStatus === 'pending') ? THUMBNAIL_POLL_MS : false),
  });

export const useWalk = (walkId: string) => useQuery(walkQueryOptions(walkId));
