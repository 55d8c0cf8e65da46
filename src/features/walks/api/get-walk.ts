import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { SightingView, WalkDetailResponse } from '@shared/schemas/sightings.ts';

export const getWalk = (walkId: string) => api<WalkDetailResponse>(`/api/walks/${encodeURIComponent(walkId)}`);

export const walkQueryKey = (walkId: string) => ['walks', 'detail', walkId] as const;

// Thumbnails are made by a background job: while a recent one is pending, ask again every few seconds.
const THUMBNAIL_POLL_MS = 3000;
// Past this age a pending thumbnail is stuck, not slow; stop asking (the placeholder stays).
const THUMBNAIL_PATIENCE_MS = 10 * 60_000;

const waitingForThumbnail = (sightings: SightingView[]) =>
  sightings.some((s) => s.thumbnailStatus === 'pending' && Date.now() - Date.parse(s.createdAt) < THUMBNAIL_PATIENCE_MS);

export const walkQueryOptions = (walkId: string) =>
  queryOptions({
    queryKey: walkQueryKey(walkId),
    queryFn: () => getWalk(walkId),
    refetchInterval: (query) => (query.state.data && waitingForThumbnail(query.state.data.sightings) ? THUMBNAIL_POLL_MS : false),
  });

export const useWalk = (walkId: string) => useQuery(walkQueryOptions(walkId));
