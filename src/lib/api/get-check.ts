// GET /api/checks/:id: one stored pattern check; polled while it is queued or running. The review page and
// the zone editor read it.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { CheckResponse, CheckView } from '@shared/schemas/checks.ts';

export const getCheck = (id: string) => api<CheckResponse>(`/api/checks/${encodeURIComponent(id)}`).then((r) => r.check);
export const checkQueryKey = (id: string) => ['checks', 'detail', id] as const;

const POLL_MS = 1000;
const isWorking = (check: CheckView | undefined) => check?.status === 'queued' || check?.status === 'running';

export const checkQueryOptions = (id: string) =>
  queryOptions({
    queryKey: checkQueryKey(id),
    queryFn: () => getCheck(id),
    // A finished check never changes: it is stored with its exact inputs.
    staleTime: (query) => (isWorking(query.state.data) ? 0 : Infinity),
    refetchInterval: (query) => (isWorking(query.state.data) ? POLL_MS : false),
  });

export const useCheck = (id: string | null) => useQuery({ ...checkQueryOptions(id ?? ''), enabled: Boolean(id) });
