import type { SessionUser } from '@shared/schemas/auth';
import { api } from './client';

export type Site = SessionUser['site'];

export const sitesApi = {
  list: () => api.get<Site[]>('/sites'),
};
