import type { AbilityBuilder, AnyMongoAbility } from '@casl/ability';
import type { Role } from '../roles.js';

type Builder = Pick<AbilityBuilder<AnyMongoAbility>, 'can' | 'cannot'>;

/**
 * Scopes, authorisations, external certificates and reminders. 'Authorisation' and 'Certificate' are a
 * holder's records (fields: holderId, siteId = the holder's site); 'Reminder' is the sweep and its sends.
 */
export function authorisationRules({ can }: Builder, actor: { id: string; siteIds: readonly string[] }, has: (r: Role) => boolean) {
  can('read', 'Scope');
  // Everyone sees their own authorisations, certificates and eligibility.
  can('read', ['Authorisation', 'Certificate'], { holderId: actor.id });
  if (has('technician') || has('assessor') || has('manager')) can('create', 'Certificate', { holderId: actor.id });
  if (has('manager')) {
    const sites = [...actor.siteIds];
    can(['create', 'update'], 'Scope');
    // Record paper authorisations, suspend, reinstate and revoke; check certificates: at the sites they cover.
    can(['read', 'create', 'update'], ['Authorisation', 'Certificate'], { siteId: { $in: sites } });
    can(['read', 'create'], 'Reminder');
  }
  if (has('admin')) {
    can('read', ['Authorisation', 'Certificate', 'Reminder']);
    can('create', 'Reminder');
  }
}
