import { z } from 'zod';
import './messages.js';
import { pageQuery } from './common.js';

export const MAIL_STATUSES = ['waiting', 'sending', 'sent', 'failed', 'cancelled'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

export const mailListQuery = pageQuery.omit({ q: true }).extend({ status: z.enum(MAIL_STATUSES).optional() });
export type MailListQuery = z.infer<typeof mailListQuery>;

/** A message in the outbox, as the outbox page receives it. */
export const mailRow = z.object({
  id: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  kind: z.string(),
  status: z.enum(MAIL_STATUSES),
  attempts: z.number(),
  nextAttemptAt: z.string(),
  fileName: z.string().nullable(),
  /** The last attempt's error, while it is retried or once it has failed. */
  error: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type MailRow = z.infer<typeof mailRow>;
/** One page of the outbox, with how many messages are in each status. */
export type MailPage = { items: MailRow[]; total: number; page: number; pageSize: number; counts: Partial<Record<MailStatus, number>> };
/** One message with its .eml text (null when the file is gone or it went by SMTP) and its stored text. */
export type MailMessage = MailRow & { raw: string | null; text: string | null };
