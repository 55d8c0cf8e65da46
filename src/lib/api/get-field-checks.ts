// GET /api/fields/:id/checks: a field's stored checks, newest first, as summary rows (no figures), a page at a time.
// The review page lists and compares them (loading older ones on "Show more"); the field page shows the latest.
import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import { CHECK_PAGE, type FieldChecksResponse } from '@shared/schemas/checks.ts';

export const getFieldChecks = (fieldId: string, pestId?: string, cursor?: string) =>
  api<FieldChecksResponse>(`/api/fields/${encodeURIComponent(fieldId)}/checks`, { query: { pestId, limit: CHECK_PAGE.default, cursor } });
/** Every list of the field's checks (any pest): what a newly stored check invalidates. */
export const fieldChecksQueryKey = (fieldId: string) => ['fields', 'checks', fieldId] as const;
export const fieldChecksQueryOptions = (fieldId: string, pestId?: string) =>
  infiniteQueryOptions({
    queryKey: [...fieldChecksQueryKey(fieldId), { pestId: pestId ?? null }],
    queryFn: ({ pageParam }) => getFieldChecks(fieldId, pestId, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.nextCursor ?? undefined,
    // The pages loaded so far, joined, newest first.
    select: (data) => data.pages.flatMap((page) => page.checks),
  });
export const useFieldChecks = (fieldId: string, pestId?: string, options: { enabled?: boolean } = {}) =>
  useInfiniteQuery({ ...fieldChecksQueryOptions(fieldId, pestId), enabled: options.enabled ?? true });
