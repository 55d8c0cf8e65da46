import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '../../../lib/api-client.ts';
import { walkStartedOffline, type WalkStartedOffline } from '../outbox/outbox-store.ts';
import type { SightingView, WalkDetailResponse } from '@shared/schemas/sightings.ts';

export const getWalk = (walkId: string) => api<WalkDetailResponse>(`/api/walks/${encodeURIComponent(walkId)}`);

/** A walk started without signal, as its page shows it until the server has it: no sightings yet, what waits is in the outbox. */
function walkKeptOnPhone(walk: WalkStartedOffline, scoutName: string): WalkShown {
  return {
    walk: {
      id: walk.id,
      fieldId: walk.fieldId,
      fieldName: walk.fieldName,
      scoutId: walk.ownerId,
      scoutName,
      walkedOn: walk.walkedOn,
      notes: '',
      sightingCount: 0,
      stopCount: 0,
      createdAt: new Date(walk.createdAt).toISOString(),
      finishedAt: null,
    },
    sightings: [],
    removed: [],
    keptOnPhone: true,
  };
}

/**
 * The server's walk; for a walk started on this phone without signal, the server's answer once it has it (under the
 * id it chose) and the phone's own record until then.
 */
async function walkFromServerOrPhone(walkId: string, scoutName: string): Promise<WalkShown> {
  const onPhone = await walkStartedOffline(walkId).catch(() => undefined);
  const serverId = onPhone?.serverId ?? walkId;
  try {
    return { ...(await getWalk(serverId)), keptOnPhone: false };
  } catch (error) {
    const notThereYet = error instanceof ApiError && (error.status === 0 || error.status === 404);
    if (onPhone && notThereYet) return walkKeptOnPhone(onPhone, scoutName);
    throw error;
  }
}

export type WalkShown = WalkDetailResponse & { keptOnPhone: boolean };

export const walkQueryKey = (walkId: string) => ['walks', 'detail', walkId] as const;

// Thumbnails are made by a background job: while a recent one is pending, ask again every few seconds.
const THUMBNAIL_POLL_MS = 3000;
// Past this age a pending thumbnail is stuck, not slow; stop asking (the placeholder stays).
const THUMBNAIL_PATIENCE_MS = 10 * 60_000;

const waitingForThumbnail = (sightings: SightingView[]) =>
  sightings.some((s) => s.thumbnailStatus === 'pending' && Date.now() - Date.parse(s.createdAt) < THUMBNAIL_PATIENCE_MS);

export const walkQueryOptions = (walkId: string, scoutName = '') =>
  queryOptions({
    queryKey: walkQueryKey(walkId),
    queryFn: () => walkFromServerOrPhone(walkId, scoutName),
    refetchInterval: (query) => (query.state.data && waitingForThumbnail(query.state.data.sightings) ? THUMBNAIL_POLL_MS : false),
  });

export const useWalk = (walkId: string, scoutName?: string) => useQuery(walkQueryOptions(walkId, scoutName));
