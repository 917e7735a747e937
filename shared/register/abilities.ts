import type { AbilityBuilder, AnyMongoAbility } from '@casl/ability';
import type { Role } from '../roles.js';

type Builder = Pick<AbilityBuilder<AnyMongoAbility>, 'can' | 'cannot'>;

/**
 * The register (and its matrix, overview and incident packs), person records and findings. 'Register',
 * 'Overview' and 'PersonRecord' have the person's siteId (and personId); a 'Finding' has the siteId of the
 * record it is about, or none for an organisation-wide record. Auditors read all of it by their own rule.
 */
export function registerRules({ can }: Builder, actor: { id: string; siteIds: readonly string[] }, has: (r: Role) => boolean) {
  // Everyone may see their own record; nobody else's without a role that reads registers.
  can('read', 'PersonRecord', { personId: actor.id });
  if (has('manager')) {
    const sites = { $in: [...actor.siteIds] };
    can('read', ['Register', 'Overview', 'PersonRecord'], { siteId: sites });
    can('read', 'Finding');
    // Managers answer and close findings about their sites, and those about no site in particular.
    can('update', 'Finding', { siteId: sites });
    can('update', 'Finding', { siteId: null });
  }
  if (has('auditor')) can('create', 'Finding');
  if (has('admin')) can('read', ['Register', 'Overview', 'PersonRecord', 'Finding', 'AuditLog']);
}
