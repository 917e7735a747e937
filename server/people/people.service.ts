import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { InviteBody, UpdatePersonBody } from '../../shared/schemas/people.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { users } from '../db/schema/index.js';
import { conflict, forbidden, notFound } from '../errors.js';
import type { AuthService } from '../auth/auth.service.js';
import { deleteSessionsOf } from '../auth/sessions.repository.js';
import * as repo from './people.repository.js';
import { checkGrants, refuse, subjectOfPerson, type PersonState } from './people.guards.js';
import { present } from './people.present.js';
import { checkSitesExist, makePersonUpdate } from './people.update.js';

export function makePeopleService(deps: Deps, auth: AuthService) {
  const { db, clock, audit } = deps;

  async function view(id: string): Promise<PersonState> {
    const user = await repo.findUserById(db, id);
    if (!user) throw notFound('That person');
    const [roles, coveredSiteIds] = await Promise.all([repo.rolesOf(db, id), repo.coveredSitesOf(db, id)]);
    return { user, roles, coveredSiteIds };
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
    if (!ability.can('invite', subjectOf('User', { siteId: body.siteId }))) throw refuse('siteId', 'you may not invite people to that site');
    // A new person holds no roles yet: every role and site asked for is a grant.
    const none = { user: { siteId: body.siteId } as repo.UserRow, roles: [], coveredSiteIds: [] };
    checkGrants(actor, ability, none, { roles: body.roles, coveredSiteIds: body.coveredSiteIds });
    await checkSitesExist(db, [body.siteId, ...body.coveredSiteIds]);
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
    if (!ability.can('invite', subjectOfPerson(v))) throw forbidden('You may not invite this person.');
    if (!v.user.active) throw conflict('This person is deactivated.');
    await auth.issueLink(v.user.id, v.user.email, v.user.name, v.user.passwordHash ? 'reset' : 'invite', actor.id);
  }

  /** DELETE /people/:id/sessions: every stored session of the person ends (the caller's own current one stays). */
  async function endSessions(actor: Actor, id: string, currentSid?: string) {
    await view(id);
    return db.transaction(async (tx) => {
      const ended = await deleteSessionsOf(tx, id, id === actor.id ? currentSid : undefined);
      await audit(tx, { actorId: actor.id, action: 'person.sessions_ended', entity: 'user', entityId: id, newValues: { ended } });
      return { ended };
    });
  }

  const updatePerson = makePersonUpdate(deps);
  async function update(actor: Actor, ability: AppAbility, id: string, body: UpdatePersonBody) {
    await updatePerson(actor, ability, id, body);
    return present(await view(id));
  }

  return { list, get, invite, resendInvite, update, endSessions };
}
