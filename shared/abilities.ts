import { AbilityBuilder, createMongoAbility, subject, type MongoAbility, type ForcedSubject, type MongoQuery, type AnyMongoAbility } from '@casl/ability';
import type { Role } from './roles.js';
import { procedureRules } from './procedures/abilities.js';
import { authorisationRules } from './authorisations/abilities.js';
import { recordRules } from './practicals/abilities.js';
import { registerRules } from './register/abilities.js';

export type Action = 'manage' | 'create' | 'read' | 'update' | 'delete' | 'invite' | 'assignRole' | 'approve' | 'review';
export type SubjectName = 'User' | 'Site' | 'MailLog' | 'AuditLog' | 'Bench' | 'BenchCheck' | 'Instrument' | 'Evidence' | 'Procedure' | 'Acknowledgement' | 'ReviewReminder' | 'Scope' | 'Authorisation' | 'Certificate' | 'Reminder' | 'Signoff' | 'Practical' | 'Register' | 'Overview' | 'PersonRecord' | 'Finding' | 'Session' | 'all';
export type Subject = SubjectName | (ForcedSubject<Exclude<SubjectName, 'all'>> & Record<string, any>);
// Conditions are plain Mongo-style queries over a record's own fields (id, siteId, userId, …).
export type AppAbility = MongoAbility<[Action, Subject], MongoQuery<Record<string, any>>>;

/** Tags a record with its subject type for object-level checks. */
export function subjectOf(type: Exclude<SubjectName, 'all'>, record: object): Subject {
  return subject(type, { ...record } as Record<string, any>);
}

/** What the server knows about the signed-in person when deciding. */
export interface Actor {
  id: string;
  roles: readonly Role[];
  siteId: string;
  /** Own site plus the sites an assessor or manager covers. */
  siteIds: readonly string[];
}

/** Roles only an admin may give, and whose holders only an admin may change. */
export const ADMIN_ONLY_ROLES: readonly Role[] = ['manager', 'auditor', 'admin'];
/** The fields of a person's record that decide their reach; nobody changes these on their own record. */
export const SELF_LOCKED_FIELDS = ['siteId', 'coveredSiteIds', 'roles', 'accessEndsOn', 'active', 'deactivatedReason'] as const;

/** One definition for server and client. Object rules use the record's own fields (id, siteId, userId). */
export function defineAbilityFor(actor: Actor | null): AppAbility {
  // The builder is untyped on conditions (CASL infers `never` for string subjects); the result is typed.
  const { can, cannot, build } = new AbilityBuilder<AnyMongoAbility>(createMongoAbility);
  if (!actor) return build() as AppAbility;
  const has = (r: Role) => actor.roles.includes(r);
  const sites = [...actor.siteIds];

  can('read', 'User', { id: actor.id });
  can('update', 'User', ['name'], { id: actor.id });
  can('read', 'Site');
  can('read', 'Evidence', { ownerId: actor.id });
  if (has('technician') || has('assessor') || has('manager')) {
    // Bench staff see the benches and instruments of their sites and record pre-use checks there.
    can('read', ['Bench', 'Instrument', 'BenchCheck'], { siteId: { $in: sites } });
    can('create', 'BenchCheck', { siteId: { $in: sites } });
    can('create', 'Evidence', { ownerId: actor.id });
  }
  if (has('assessor') || has('manager')) can(['read', 'create'], 'Evidence', { siteId: { $in: sites } });

  if (has('manager')) {
    can('read', 'User', { siteId: { $in: sites } });
    // People of the sites they cover who hold none of the roles only an admin changes. The record carries
    // its `roles`; for an invitation they are the roles asked for (none yet: only the site counts).
    can(['invite', 'update', 'assignRole'], 'User', { siteId: { $in: sites }, roles: { $nin: [...ADMIN_ONLY_ROLES] } });
    can('manage', ['Bench', 'Instrument'], { siteId: { $in: sites } });
  }
  procedureRules({ can, cannot }, actor, has);
  authorisationRules({ can, cannot }, actor, has);
  recordRules({ can, cannot }, actor, has);
  registerRules({ can, cannot }, actor, has);
  if (has('auditor')) {
    // Auditors read everything and write nothing.
    can('read', 'all');
    if (!has('admin')) cannot('read', 'MailLog');
  }
  if (has('admin')) {
    can(['read', 'invite', 'update', 'assignRole'], 'User');
    can('delete', 'Session');
    can('manage', 'Site');
    can('read', 'MailLog');
    can('read', 'Evidence');
  }
  // Nobody widens their own reach, whatever their roles: of their own record only the name is theirs to change.
  cannot('update', 'User', [...SELF_LOCKED_FIELDS], { id: actor.id });
  cannot('assignRole', 'User', { id: actor.id });
  return build() as AppAbility;
}

/** Roles each granting role may hand out; an admin may give any. */
export function grantableRoles(actor: Actor): Role[] {
  if (actor.roles.includes('admin')) return ['technician', 'assessor', 'manager', 'auditor', 'admin'];
  if (actor.roles.includes('manager')) return ['technician', 'assessor'];
  return [];
}
