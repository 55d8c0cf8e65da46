import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MailMessageResponse } from '@shared/schemas/mailbox.ts';

export const getMailMessage = (id: number) => api<MailMessageResponse>(`/api/mailbox/${id}`).then((r) => r.message);
// A received message never changes.
export const mailMessageQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['mailbox', 'detail', id], queryFn: () => getMailMessage(id), staleTime: Infinity });
export const useMailMessage = (id: number) => useQuery(mailMessageQueryOptions(id));

export const attachmentUrl = (messageId: number, index: number) => `/api/mailbox/${messageId}/attachments/${index}`;
