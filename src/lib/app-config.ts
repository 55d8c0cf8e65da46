// The deployment's public settings (tile URL, whether the mail catcher runs) and the organisation's date format.
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DateFormat } from '@shared/dates/format-dates.ts';
import { api } from './api-client.ts';

export interface AppConfig {
  tileUrl: string;
  mailCatcher: boolean;
  /** The signed-in organisation's locale and time zone (the default for a visitor). */
  dateFormat: DateFormat;
}

export const getAppConfig = () => api<AppConfig>('/api/config');
export const appConfigQueryOptions = () => queryOptions({ queryKey: ['config'], queryFn: getAppConfig, staleTime: Infinity });
export const useAppConfig = () => useQuery(appConfigQueryOptions());
