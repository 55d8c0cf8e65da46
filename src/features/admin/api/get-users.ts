import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { UserListResponse } from '@shared/schemas/users.ts';

export const getUsers = () => api<UserListResponse>('/api/users').then((r) => r.users);
export const usersQueryKey = ['users'] as const;
export const usersQueryOptions = () => queryOptions({ queryKey: usersQueryKey, queryFn: getUsers });
export const useUsers = () => useQuery(usersQueryOptions());
