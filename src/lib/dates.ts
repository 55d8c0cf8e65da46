// The organisation's way of writing dates (GET /api/config), bound once for a component.
import { useMemo } from 'react';
import { DEFAULT_DATE_FORMAT, datesIn, type DateFormat, type Dates } from '@shared/dates/format-dates.ts';
import { useAppConfig } from './app-config.ts';

/** Date writers in the signed-in organisation's locale and zone; `format` overrides it (a notice keeps its own). */
export function useDates(format?: DateFormat): Dates {
  const config = useAppConfig();
  const { locale, timeZone } = format ?? config.data?.dateFormat ?? DEFAULT_DATE_FORMAT;
  return useMemo(() => datesIn({ locale, timeZone }), [locale, timeZone]);
}
