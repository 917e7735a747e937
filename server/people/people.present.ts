import type { PersonDetail } from '../../shared/schemas/people.js';
import type { PersonState } from './people.guards.js';

/** A person as the API shows them. */
export function present(v: PersonState): PersonDetail {
  const { user, roles, coveredSiteIds } = v;
  return {
    id: user.id, email: user.email, name: user.name, siteId: user.siteId, roles, coveredSiteIds, active: user.active,
    accessEndsOn: user.accessEndsOn, deactivatedReason: user.deactivatedReason, hasPassword: user.passwordHash !== null,
    createdAt: user.createdAt.toISOString(),
  };
}
