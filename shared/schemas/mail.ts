import { z } from 'zod';
import './messages.js';

/** A row of the mail log, as the outbox page receives it. */
export const mailRow = z.object({
  id: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  kind: z.string(),
  status: z.enum(['sent', 'failed']),
  fileName: z.string().nullable(),
  error: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type MailRow = z.infer<typeof mailRow>;
/** One message with its .eml text (null when the file is gone). */
export type MailMessage = MailRow & { raw: string | null };
