// The notice page reports, once, that the grower opened it (the GET itself records nothing).
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { OpenedResponse } from '@shared/schemas/notices.ts';

export const reportNoticeOpened = (token: string) => api<OpenedResponse>(`/api/notice-links/${encodeURIComponent(token)}/opened`, { method: 'POST' });

export const useReportNoticeOpened = (token: string) => useMutation({ mutationFn: () => reportNoticeOpened(token) });
