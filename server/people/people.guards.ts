import { ADMIN_ONLY_ROLES, grantableRoles, subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { UpdatePersonBody } from '../../shared/schemas/people.js';
import type { Role } from '../../shared/roles.js';
import { AppError } from '../errors.js';
import type { UserRow } from './people.repository.js';

/** A person as the rules see them: the record's own fields plus the roles they hold. */
export interface PersonState {
  user: UserRow;
  roles: Role[];
  coveredSiteIds: string[];
}

type Field = keyof UpdatePersonBody;

/** A 403 that names the field refused, in the message and in `fields`. */
export const refuse = (field: string, why: string) => new AppError(403, 'forbidden', `${field}: ${why}`, { [field]: why });

const SELF_WORDS: Record<Exclude<Field, 'name'>, string> = {
  siteId: 'you may not move yourself to another site',
  coveredSiteIds: 'you may not give yourself sites',
  roles: 'you may not change your own roles',
  accessEndsOn: 'you may not change the end of your own access',
  active: 'you may not switch your own account off or on',
  deactivatedReason: 'you may not switch your own account off or on',
};

export const subjectOfPerson = (p: PersonState) => subjectOf('User', { ...p.user, roles: p.roles });

/** Each field sent must be one the actor may change on this person (the rules in shared/abilities.ts). */
export function checkFields(actor: Actor, ability: AppAbility, before: PersonState, body: UpdatePersonBody) {
  const target = subjectOfPerson(before);
  // An empty change writes nothing, but still only for someone the actor may change.
  if (!Object.keys(body).length && !ability.can('update', target)) throw refuse('id', 'you may not change this person');
  for (const f of Object.keys(body) as Field[]) {
    const action = f === 'roles' || f === 'coveredSiteIds' ? 'assignRole' : 'update';
    if (ability.can(action, target, f)) continue;
    if (before.user.id === actor.id && f !== 'name') throw refuse(f, SELF_WORDS[f]);
    if (!ability.can('read', target)) throw refuse(f, 'you may not change this person');
    if (before.roles.some((r) => ADMIN_ONLY_ROLES.includes(r))) throw refuse(f, 'only an admin changes a manager, auditor or admin');
    throw refuse(f, `you may not change this person's ${f}`);
  }
}

/** Roles added or taken away must be ones the actor may hand out, and sites ones they may place people at. */
export function checkGrants(actor: Actor, ability: AppAbility, before: PersonState, body: Pick<UpdatePersonBody, 'roles' | 'siteId' | 'coveredSiteIds'>) {
  if (body.roles) {
    const changed = [...new Set([...body.roles, ...before.roles])].filter((r) => body.roles!.includes(r) !== before.roles.includes(r));
    const refused = changed.filter((r) => !grantableRoles(actor).includes(r));
    if (refused.length) throw refuse('roles', `you may not give or take the role(s): ${refused.join(', ')}`);
  }
  const mayPlace = (siteId: string) => ability.can('invite', subjectOf('User', { siteId }));
  if (body.siteId !== undefined && !mayPlace(body.siteId)) throw refuse('siteId', 'you may not place people at that site');
  if (body.coveredSiteIds?.some((s) => !mayPlace(s))) throw refuse('coveredSiteIds', 'you may not give a site you do not cover yourself');
  // The person as they would be after the change must still be someone the actor may change.
  if (!body.roles && body.siteId === undefined) return;
  const after = subjectOf('User', { ...before.user, siteId: body.siteId ?? before.user.siteId, roles: body.roles ?? before.roles });
  if (!ability.can('update', after)) throw refuse(body.roles ? 'roles' : 'siteId', 'the person would be out of your reach after this change');
}

/** An admin who keeps the system administrable: active, holding admin, with no end to their access. */
export const isStandingAdmin = (u: Pick<UserRow, 'active' | 'accessEndsOn'>, roles: readonly Role[]) =>
  u.active && u.accessEndsOn === null && roles.includes('admin');

/** Refuses (409) a change that would leave no standing admin; `others` are the other standing admins, locked. */
export function checkLastAdmin(before: PersonState, body: UpdatePersonBody, others: string[]) {
  if (!isStandingAdmin(before.user, before.roles) || others.length) return;
  const why = (field: string, what: string) => new AppError(409, 'last_admin', `${field}: the last active admin ${what}`, { [field]: `the last active admin ${what}` });
  if (body.active === false) throw why('active', 'cannot be switched off');
  if (body.accessEndsOn) throw why('accessEndsOn', 'cannot be given an access end date');
  if (body.roles && !body.roles.includes('admin')) throw why('roles', 'cannot lose the admin role');
}
