import type { Page } from '@shared/schemas/common';
import type { MailMessage, MailRow } from '@shared/schemas/mail';
import { api } from './client';

export type { MailRow, MailMessage };

export const mailApi = {
  list: (page: number, pageSize: number) => api.get<Page<MailRow>>('/mail', { page, pageSize }),
  get: (id: string) => api.get<MailMessage>(`/mail/${id}`),
};
