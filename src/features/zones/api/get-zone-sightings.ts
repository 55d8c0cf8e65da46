// The placed sightings of a pest on a field, to count those inside a zone while it is being edited.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

export interface ZoneSighting {
  id: string;
  count: number | null;
  position: { lon: number; lat: number } | null;
}

export const getZoneSightings = (fieldId: string, pestId: string) =>
  api<{ sightings: ZoneSighting[] }>('/api/sightings', { query: { fieldId, pestId, status: 'placed' } }).then((r) => r.sightings);
export const zoneSightingsQueryOptions = (fieldId: string, pestId: string) =>
  queryOptions({ queryKey: ['sightings', 'list', { fieldId, pestId, status: 'placed' }], queryFn: () => getZoneSightings(fieldId, pestId) });
export const useZoneSightings = (fieldId: string, pestId: string | null) =>
  useQuery({ ...zoneSightingsQueryOptions(fieldId, pestId ?? ''), enabled: Boolean(pestId) });
