import { defineAbilityFor, type Actor, type AppAbility } from '@shared/abilities';
import type { SessionUser } from '@shared/schemas/auth';

/** The one ability instance: the router guards read it and @casl/vue makes it reactive in components. */
export const ability: AppAbility = defineAbilityFor(null);

export function actorOf(user: SessionUser | null): Actor | null {
  return user ? { id: user.id, roles: user.roles, siteId: user.site.id, siteIds: user.siteIds } : null;
}

/** Replaces the rules in place, so every holder of `ability` sees the change. */
export function applySession(user: SessionUser | null): void {
  ability.update(defineAbilityFor(actorOf(user)).rules);
}
