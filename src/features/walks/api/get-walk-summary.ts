import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WalkSummaryResponse } from '@shared/schemas/walks.ts';
import { walkQueryKey } from './get-walk.ts';

export const getWalkSummary = (walkId: string) => api<WalkSummaryResponse>(`/api/walks/${encodeURIComponent(walkId)}/summary`);

// Under the walk's own key, so whatever changes the walk (a photo, a stop, a removal) refreshes its summary too.
export const walkSummaryQueryKey = (walkId: string) => [...walkQueryKey(walkId), 'summary'] as const;

export const walkSummaryQueryOptions = (walkId: string) => queryOptions({ queryKey: walkSummaryQueryKey(walkId), queryFn: () => getWalkSummary(walkId) });

/** Asked for only once the scout finishes the walk. */
export const useWalkSummary = (walkId: string, enabled: boolean) => useQuery({ ...walkSummaryQueryOptions(walkId), enabled });
