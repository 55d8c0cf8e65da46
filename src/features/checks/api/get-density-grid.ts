// GET /api/checks/:id/density: a finished check's density grid, fetched only when the map's density layer opens.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiBytes } from '../../../lib/api-client.ts';

/** Sightings per ha, row-major from the south; NaN where the cell centre lies outside the field. */
export const getDensityGrid = (checkId: string) => apiBytes(`/api/checks/${encodeURIComponent(checkId)}/density`).then((bytes) => new Float64Array(bytes));
export const densityGridQueryKey = (checkId: string) => ['checks', 'detail', checkId, 'density'] as const;

export const densityGridQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: densityGridQueryKey(checkId),
    queryFn: () => getDensityGrid(checkId),
    // A finished check's grid never changes.
    staleTime: Infinity,
  });

export const useDensityGrid = (checkId: string) => useQuery(densityGridQueryOptions(checkId));
