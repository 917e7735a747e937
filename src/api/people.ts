import type { Page } from '@shared/schemas/common';
import type { InviteBody, PersonRow, UpdatePersonBody } from '@shared/schemas/people';
import type { Role } from '@shared/roles';
import { api } from './client';

export type { PersonRow, InviteBody, UpdatePersonBody };

/** GET /api/people/:id (the server's `present()`): a row without the site name, plus the deactivation reason. */
export type Person = Omit<PersonRow, 'siteName'> & { deactivatedReason: string | null };

export interface PeopleQuery {
  page: number;
  pageSize: number;
  q?: string;
  siteId?: string;
  role?: Role;
  active?: 'true' | 'false';
  sort: 'name' | 'email' | 'site' | 'createdAt';
  dir: 'asc' | 'desc';
}

export const peopleApi = {
  list: (query: PeopleQuery) => api.get<Page<PersonRow>>('/people', { ...query }),
  get: (id: string) => api.get<Person>(`/people/${id}`),
  invite: (body: InviteBody) => api.post<Person>('/people', body),
  update: (id: string, body: UpdatePersonBody) => api.patch<Person>(`/people/${id}`, body),
  resendInvitation: (id: string) => api.post<{ message: string }>(`/people/${id}/invitation`),
};
