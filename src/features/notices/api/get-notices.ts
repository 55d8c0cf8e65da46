// The organisation's notices for one field, newest first.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticeView } from '@shared/schemas/notices.ts';

export const getNotices = (fieldId: string) => api<{ notices: NoticeView[] }>('/api/notices', { query: { fieldId } }).then((r) => r.notices);
export const noticesQueryOptions = (fieldId: string) => queryOptions({ queryKey: ['notices', 'list', { fieldId }], queryFn: () => getNotices(fieldId) });
export const useNotices = (fieldId: string) => useQuery(noticesQueryOptions(fieldId));
