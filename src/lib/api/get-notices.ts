// The organisation's notices for one field, newest first.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../api-client.ts';
import type { NoticeView } from '@shared/schemas/notices.ts';

export const getNotices = (fieldId: string) => api<{ notices: NoticeView[] }>('/api/notices', { query: { fieldId } }).then((r) => r.notices);
/** Every field's notice list: what a new or sent notice invalidates. */
export const noticeListsQueryKey = ['notices', 'list'] as const;
export const noticesQueryOptions = (fieldId: string) => queryOptions({ queryKey: [...noticeListsQueryKey, { fieldId }], queryFn: () => getNotices(fieldId) });
export const useNotices = (fieldId: string) => useQuery(noticesQueryOptions(fieldId));
