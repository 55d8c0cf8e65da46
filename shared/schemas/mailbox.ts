// The development mailbox's answers (the local mail catcher's messages), as the admin's mailbox page reads them.
import { z } from 'zod';

export const mailSummarySchema = z.object({
  id: z.number().int(),
  from: z.string().nullable(),
  to: z.array(z.string()),
  subject: z.string().nullable(),
  /** ISO 8601, as JSON carries a Date. */
  receivedAt: z.string(),
});
export type MailSummary = z.infer<typeof mailSummarySchema>;

export const mailMessageSchema = mailSummarySchema.extend({
  text: z.string(),
  html: z.string().nullable(),
  attachments: z.array(z.object({ index: z.number().int(), filename: z.string(), contentType: z.string(), size: z.number() })),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;

export interface MailListResponse {
  messages: MailSummary[];
}
export interface MailMessageResponse {
  message: MailMessage;
}
