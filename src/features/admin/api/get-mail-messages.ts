import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MailSummary } from '../../../types/api.ts';

export const getMailMessages = () => api<{ messages: MailSummary[] }>('/api/mailbox').then((r) => r.messages);
export const mailMessagesQueryOptions = () => queryOptions({ queryKey: ['mailbox', 'list'], queryFn: getMailMessages, staleTime: 0 });
export const useMailMessages = () => useQuery(mailMessagesQueryOptions());
