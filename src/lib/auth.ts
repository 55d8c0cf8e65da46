// Who is signed in: one query on /api/auth/me that every guard and the top bar read.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from './api-client.ts';
import { meQueryKey } from './query-client.ts';
import type { UserView } from '@shared/schemas/users.ts';

export const getMe = () => api<{ user: UserView | null }>('/api/auth/me');

export const meQueryOptions = () => queryOptions({ queryKey: meQueryKey, queryFn: getMe, staleTime: 5 * 60_000 });

export function useMe() {
  return useQuery(meQueryOptions());
}

/** The signed-in user; only for components rendered inside the signed-in guard. */
export function useSignedInUser(): UserView {
  const { data } = useMe();
  if (!data?.user) throw new Error('useSignedInUser was called outside the signed-in area.');
  return data.user;
}
