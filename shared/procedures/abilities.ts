import type { AbilityBuilder, AnyMongoAbility } from '@casl/ability';
import type { Role } from '../roles.js';

type Builder = Pick<AbilityBuilder<AnyMongoAbility>, 'can' | 'cannot'>;

/**
 * Procedures and acknowledgements. A 'Procedure' subject is one version (fields: status, authorId);
 * an 'Acknowledgement' is one person's standing on a procedure (fields: userId, siteId).
 */
export function procedureRules({ can, cannot }: Builder, actor: { id: string; siteIds: readonly string[] }, has: (r: Role) => boolean) {
  if (has('technician') || has('assessor')) {
    // Bench staff work to what is in force, and only that.
    can('read', 'Procedure', { status: 'published' });
    can('create', 'Acknowledgement');
    can('read', 'Acknowledgement', { userId: actor.id });
  }
  if (has('manager')) {
    can(['read', 'create', 'update', 'approve'], 'Procedure');
    // Four eyes: never one's own draft (editors are refused in the service, the database checks both).
    cannot('approve', 'Procedure', { authorId: actor.id });
    // Approvers of any site need to see everyone a new version affects.
    can('read', 'Acknowledgement');
    can('update', 'Acknowledgement', { siteId: { $in: [...actor.siteIds] } });
    can('create', 'ReviewReminder');
  }
  if (has('admin')) {
    can('read', 'Procedure');
    can('create', 'ReviewReminder');
  }
}
