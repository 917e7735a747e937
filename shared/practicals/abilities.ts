import type { AbilityBuilder, AnyMongoAbility } from '@casl/ability';
import type { Role } from '../roles.js';

type Builder = Pick<AbilityBuilder<AnyMongoAbility>, 'can' | 'cannot'>;

/**
 * Sign-offs (fields: personId, siteId) and practicals (technicianId, assessorId, siteId). An assessor
 * countersigns ('approve') and assesses only other people, at the sites they cover.
 */
export function recordRules({ can, cannot }: Builder, actor: { id: string; siteIds: readonly string[] }, has: (r: Role) => boolean) {
  const sites = { $in: [...actor.siteIds] };
  if (has('technician') || has('assessor')) {
    can(['create', 'read', 'update'], 'Signoff', { personId: actor.id });
    can('read', 'Practical', { technicianId: actor.id });
  }
  if (has('assessor')) {
    can('read', ['Signoff', 'Practical'], { siteId: sites });
    can('approve', 'Signoff', { siteId: sites });
    cannot('approve', 'Signoff', { personId: actor.id });
    can('create', 'Practical', { siteId: sites });
    cannot('create', 'Practical', { technicianId: actor.id });
    can('update', 'Practical', { assessorId: actor.id });
  }
  if (has('manager')) can('read', ['Signoff', 'Practical'], { siteId: sites });
  // 'review': the site-wide lists of what awaits a countersignature and of practicals (pages and navigation).
  if (has('assessor') || has('manager')) can('review', ['Signoff', 'Practical'], { siteId: sites });
  if (has('auditor')) can('review', ['Signoff', 'Practical']);
}
