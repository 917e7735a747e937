import type { SessionUser } from '@shared/schemas/auth';
import { api, isApiError } from './client';

export type { SessionUser };

export const sessionApi = {
  /** The signed-in person, or null when nobody is signed in. */
  async current(): Promise<SessionUser | null> {
    try {
      return await api.get<SessionUser>('/session', undefined, { allowUnauthorized: true });
    } catch (e) {
      if (isApiError(e) && e.status === 401) return null;
      throw e;
    }
  },
  signIn: (email: string, password: string) => api.post<SessionUser>('/session', { email, password }),
  signOut: () => api.delete<void>('/session'),
  changePassword: (currentPassword: string, newPassword: string) =>
    api.put<void>('/session/password', { currentPassword, newPassword }),
};
