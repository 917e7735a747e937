import type { Page } from '@shared/schemas/common';
import type { InviteBody, PeopleQuery, PersonDetail, PersonRow, UpdatePersonBody } from '@shared/schemas/people';
import { api } from './client';

export type { PersonRow, InviteBody, UpdatePersonBody };

export type Person = PersonDetail;
export type { PeopleQuery };

export const peopleApi = {
  list: (query: PeopleQuery) => api.get<Page<PersonRow>>('/people', { ...query }),
  get: (id: string) => api.get<Person>(`/people/${id}`),
  invite: (body: InviteBody) => api.post<Person>('/people', body),
  update: (id: string, body: UpdatePersonBody) => api.patch<Person>(`/people/${id}`, body),
  resendInvitation: (id: string) => api.post<{ message: string }>(`/people/${id}/invitation`),
  /** Admins: every stored session of the person ends (they sign in again). */
  endSessions: (id: string) => api.delete<{ ended: number }>(`/people/${id}/sessions`),
};
