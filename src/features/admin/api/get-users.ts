import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { User } from '../../../types/api.ts';

export const getUsers = () => api<{ users: User[] }>('/api/users').then((r) => r.users);
export const usersQueryOptions = () => queryOptions({ queryKey: ['users'], queryFn: getUsers });
export const useUsers = () => useQuery(usersQueryOptions());
