import { computed, type Ref } from 'vue';
import { useAbility } from '@casl/vue';
import { subjectOf, type AppAbility } from '@shared/abilities';
import type { Person } from '@/api';
import { useSessionStore } from '@/stores/session';

export type LockableField = 'name' | 'siteId' | 'roles' | 'coveredSiteIds' | 'accessEndsOn' | 'active';

const SELF: Record<LockableField, string> = {
  name: '',
  siteId: 'You cannot move yourself to another site.',
  roles: 'You cannot change your own roles.',
  coveredSiteIds: 'You cannot give yourself sites.',
  accessEndsOn: 'You cannot change the end of your own access.',
  active: 'You cannot switch your own account off.',
};

/**
 * Which fields of this person the signed-in person may not change, each with the reason shown beside it.
 * The same rules as the server (shared/abilities.ts), which decides.
 */
export function usePersonLocks(person: Ref<Person | null>) {
  const { can } = useAbility<AppAbility>();
  const session = useSessionStore();
  return computed<Partial<Record<LockableField, string>>>(() => {
    const p = person.value;
    if (!p) return {};
    const target = subjectOf('User', p);
    const self = p.id === session.user?.id;
    const locks: Partial<Record<LockableField, string>> = {};
    for (const f of Object.keys(SELF) as LockableField[]) {
      const action = f === 'roles' || f === 'coveredSiteIds' ? 'assignRole' : 'update';
      if (!can(action, target, f)) locks[f] = self && SELF[f] ? SELF[f] : 'Only an admin changes this for this person.';
    }
    return locks;
  });
}
