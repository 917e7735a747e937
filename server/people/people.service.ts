import type { Deps } from '../deps.js';
import { grantableRoles, subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { InviteBody, PersonDetail, UpdatePersonBody } from '../../shared/schemas/people.js';
import type { Role } from '../../shared/roles.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { users } from '../db/schema/index.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import type { AuthService } from '../auth/auth.service.js';
import { countSites } from '../sites/sites.repository.js';
import * as repo from './people.repository.js';
import { endAuthorisationsOf } from '../authorisations/ending.js';

export function makePeopleService(deps: Deps, auth: AuthService) {
  const { db, clock, audit } = deps;

  async function view(id: string) {
    const user = await repo.findUserById(db, id);
    if (!user) throw notFound('That person');
    const [roles, coveredSiteIds] = await Promise.all([repo.rolesOf(db, id), repo.coveredSitesOf(db, id)]);
    return { user, roles, coveredSiteIds };
  }

  function present(v: Awaited<ReturnType<typeof view>>): PersonDetail {
    const { user, roles, coveredSiteIds } = v;
    return {
      id: user.id, email: user.email, name: user.name, siteId: user.siteId, roles, coveredSiteIds, active: user.active,
      accessEndsOn: user.accessEndsOn, deactivatedReason: user.deactivatedReason, hasPassword: user.passwordHash !== null,
      createdAt: user.createdAt.toISOString(),
    };
  }

  function checkGrant(actor: Actor, roles: Role[]) {
    const allowed = grantableRoles(actor);
    const refused = roles.filter((r) => !allowed.includes(r));
    if (refused.length) throw forbidden(`You may not give the role(s): ${refused.join(', ')}.`);
  }

  async function checkSites(siteIds: string[]) {
    const unique = [...new Set(siteIds)];
    if ((await countSites(db, unique)) !== unique.length) throw unprocessable('siteId: no such site', { siteId: 'no such site' });
  }

  async function list(ability: AppAbility, q: Omit<repo.PeopleFilter, 'access' | 'active'> & { active?: 'true' | 'false' }) {
    const access = accessibleWhere(ability, 'read', 'User', { id: users.id, siteId: users.siteId });
    const { items, total } = await repo.listPeople(db, { ...q, access, active: q.active === undefined ? undefined : q.active === 'true' });
    return { items: items.map((i) => ({ ...i, createdAt: i.createdAt.toISOString() })), total, page: q.page, pageSize: q.pageSize };
  }

  async function get(ability: AppAbility, id: string) {
    const v = await view(id);
    if (!ability.can('read', subjectOf('User', v.user))) throw forbidden('You may not see this person.');
    return present(v);
  }

  async function invite(actor: Actor, ability: AppAbility, body: InviteBody) {
    if (!ability.can('invite', subjectOf('User', { siteId: body.siteId }))) throw forbidden('You may not invite people to that site.');
    checkGrant(actor, body.roles);
    await checkSites([body.siteId, ...body.coveredSiteIds]);
    if (await repo.findUserByEmail(db, body.email)) throw conflict('email: a person with this e-mail already exists', { email: 'already in use' });
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      const user = await repo.insertUser(tx, {
        email: body.email, name: body.name, siteId: body.siteId, active: true, accessEndsOn: body.accessEndsOn ?? null, createdAt: now, updatedAt: now,
      });
      await repo.replaceRoles(tx, user.id, body.roles);
      await repo.replaceCoveredSites(tx, user.id, body.coveredSiteIds.filter((s) => s !== body.siteId));
      await audit(tx, { actorId: actor.id, action: 'person.invited', entity: 'user', entityId: user.id, newValues: { ...body } });
      return user;
    });
    await auth.issueLink(created.id, created.email, created.name, 'invite', actor.id);
    return present(await view(created.id));
  }

  async function resendInvite(actor: Actor, ability: AppAbility, id: string) {
    const v = await view(id);
    if (!ability.can('invite', subjectOf('User', v.user))) throw forbidden('You may not invite this person.');
    if (!v.user.active) throw conflict('This person is deactivated.');
    await auth.issueLink(v.user.id, v.user.email, v.user.name, v.user.passwordHash ? 'reset' : 'invite', actor.id);
  }

  async function update(actor: Actor, ability: AppAbility, id: string, body: UpdatePersonBody) {
    const before = await view(id);
    const target = subjectOf('User', before.user);
    const fields = Object.keys(body) as (keyof UpdatePersonBody)[];
    for (const f of fields) {
      const action = f === 'roles' || f === 'coveredSiteIds' ? 'assignRole' : 'update';
      if (!ability.can(action, target, action === 'update' ? f : undefined)) throw forbidden(`You may not change ${f} of this person.`);
    }
    if (body.roles) checkGrant(actor, [...new Set([...body.roles, ...before.roles])].filter((r) => body.roles!.includes(r) !== before.roles.includes(r)));
    if (body.siteId && !ability.can('update', subjectOf('User', { siteId: body.siteId }))) throw forbidden('You may not move people to that site.');
    if (body.siteId || body.coveredSiteIds) await checkSites([body.siteId ?? before.user.siteId, ...(body.coveredSiteIds ?? [])]);
    if (body.active === false && !body.deactivatedReason) throw unprocessable('deactivatedReason: give a reason', { deactivatedReason: 'give a reason' });
    if (id === actor.id && (body.active === false || body.roles)) throw forbidden('You may not deactivate yourself or change your own roles.');
    await db.transaction(async (tx) => {
      await repo.findUserById(tx, id, true);
      const patch: Parameters<typeof repo.updateUser>[2] = { updatedAt: clock.now() };
      if (body.name !== undefined) patch.name = body.name;
      if (body.siteId !== undefined) patch.siteId = body.siteId;
      if (body.accessEndsOn !== undefined) patch.accessEndsOn = body.accessEndsOn;
      if (body.active !== undefined) {
        patch.active = body.active;
        patch.deactivatedReason = body.active ? null : body.deactivatedReason;
      }
      await repo.updateUser(tx, id, patch);
      if (body.roles) await repo.replaceRoles(tx, id, body.roles);
      if (body.coveredSiteIds) await repo.replaceCoveredSites(tx, id, body.coveredSiteIds.filter((s) => s !== (body.siteId ?? before.user.siteId)));
      if (body.active === false && before.user.active) await endAuthorisationsOf(tx, id, { ...deps, actorId: actor.id, reason: body.deactivatedReason! });
      await audit(tx, {
        actorId: actor.id, action: body.active === false ? 'person.deactivated' : 'person.updated', entity: 'user', entityId: id,
        oldValues: pick(present(before), fields), newValues: body,
      });
    });
    return present(await view(id));
  }

  return { list, get, invite, resendInvite, update };
}

function pick(obj: Record<string, unknown>, keys: string[]) {
  return Object.fromEntries(keys.map((k) => [k, obj[k]]));
}
