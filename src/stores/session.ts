import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { Role } from '@shared/roles';
import { sessionApi, type SessionUser } from '@/api';
import { applySession } from '@/plugins/ability';

/** Which home a person with several roles lands on first: the widest responsibility. */
const HOME_ORDER: Role[] = ['admin', 'manager', 'auditor', 'assessor', 'technician'];

export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null);
  const loaded = ref(false);
  let loading: Promise<void> | null = null;

  const roles = computed<Role[]>(() => HOME_ORDER.filter((r) => user.value?.roles.includes(r)));
  const primaryRole = computed<Role | null>(() => roles.value[0] ?? null);

  function setUser(next: SessionUser | null) {
    user.value = next;
    loaded.value = true;
    applySession(next);
  }

  /** Asks the server once who is signed in; later calls reuse the answer. */
  function ensureLoaded(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    loading ??= sessionApi
      .current()
      .then(setUser)
      .finally(() => {
        loading = null;
      });
    return loading;
  }

  async function signIn(email: string, password: string) {
    setUser(await sessionApi.signIn(email, password));
  }

  async function signOut() {
    try {
      await sessionApi.signOut();
    } finally {
      setUser(null);
    }
  }

  return { user, loaded, roles, primaryRole, ensureLoaded, signIn, signOut, setUser };
});
