import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MailListResponse } from '@shared/schemas/mailbox.ts';

export const getMailMessages = () => api<MailListResponse>('/api/mailbox').then((r) => r.messages);
export const mailMessagesQueryKey = ['mailbox', 'list'] as const;
export const mailMessagesQueryOptions = () => queryOptions({ queryKey: mailMessagesQueryKey, queryFn: getMailMessages, staleTime: 0 });
export const useMailMessages = () => useQuery(mailMessagesQueryOptions());
