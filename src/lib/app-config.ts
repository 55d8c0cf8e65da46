// The deployment's public settings (tile URL, whether the mail catcher runs).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from './api-client.ts';

export interface AppConfig {
  tileUrl: string;
  mailCatcher: boolean;
}

export const getAppConfig = () => api<AppConfig>('/api/config');
export const appConfigQueryOptions = () => queryOptions({ queryKey: ['config'], queryFn: getAppConfig, staleTime: Infinity });
export const useAppConfig = () => useQuery(appConfigQueryOptions());
