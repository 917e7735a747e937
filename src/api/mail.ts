import type { Page } from '@shared/schemas/common';
import { api } from './client';

/** A row of the server's mail log (server/db/schema/core.ts `mailLog`, as JSON). */
export interface MailRow {
  id: string;
  toAddress: string;
  subject: string;
  kind: string;
  status: 'sent' | 'failed';
  fileName: string | null;
  error: string | null;
  createdAt: string;
  sentAt: string | null;
}

export interface MailMessage extends MailRow {
  /** The .eml text, or null when the file is gone. */
  raw: string | null;
}

export const mailApi = {
  list: (page: number, pageSize: number) => api.get<Page<MailRow>>('/mail', { page, pageSize }),
  get: (id: string) => api.get<MailMessage>(`/mail/${id}`),
};
