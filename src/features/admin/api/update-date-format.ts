import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DateFormat } from '@shared/dates/format-dates.ts';
import { api } from '../../../lib/api-client.ts';
import { appConfigQueryOptions } from '../../../lib/app-config.ts';

export const updateDateFormat = (format: DateFormat) =>
  api<{ dateFormat: DateFormat }>('/api/config/date-format', { method: 'PUT', body: format }).then((r) => r.dateFormat);

/** Every page reads the organisation's date format from the config query, so saving refreshes it and the dates follow. */
export function useUpdateDateFormat() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDateFormat,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: appConfigQueryOptions().queryKey }),
  });
}
