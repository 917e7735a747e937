import { api } from './client';

export interface PasswordLink {
  email: string;
  name: string;
  purpose: 'invite' | 'reset';
}

export const passwordApi = {
  link: (token: string) => api.get<PasswordLink>('/password/link', { token }),
  set: (token: string, password: string) => api.post<{ email: string }>('/password/set', { token, password }),
  forgot: (email: string) => api.post<{ message: string }>('/password/forgot', { email }),
};
