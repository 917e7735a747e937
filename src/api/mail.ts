import type { MailMessage, MailPage, MailRow, MailStatus } from '@shared/schemas/mail';
import { api } from './client';

export type { MailRow, MailMessage, MailPage, MailStatus };

export const mailApi = {
  list: (page: number, pageSize: number, status?: MailStatus) => api.get<MailPage>('/mail', status ? { page, pageSize, status } : { page, pageSize }),
  get: (id: string) => api.get<MailMessage>(`/mail/${id}`),
  /** Sends a failed message again (admins). */
  retry: (id: string) => api.post<MailRow>(`/mail/${id}/retry`),
};
