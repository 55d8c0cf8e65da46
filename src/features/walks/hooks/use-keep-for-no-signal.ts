// The scout's pages read the pest library and each field's boundary; reading them while there is signal lets the
// service worker keep them (src/sw.ts), so a walk started in a field without signal has its pests and its map.
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { pestsQueryOptions } from '../../../lib/api/get-pests.ts';
import { fieldQueryOptions } from '../../../lib/api/get-field.ts';

export function useKeepForNoSignal(fieldIds: readonly string[] = []) {
  const queryClient = useQueryClient();
  const ids = fieldIds.join(',');
  useEffect(() => {
    if (navigator.onLine === false) return;
    void queryClient.prefetchQuery(pestsQueryOptions(false));
    for (const id of ids ? ids.split(',') : []) void queryClient.prefetchQuery(fieldQueryOptions(id));
  }, [queryClient, ids]);
}
