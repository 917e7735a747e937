import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import type { UpdatePersonBody } from '../../shared/schemas/people.js';
import type { Executor } from '../db/client.js';
import { notFound, unprocessable } from '../errors.js';
import { countSites } from '../sites/sites.repository.js';
import { deleteSessionsOf } from '../auth/sessions.repository.js';
import { endAuthorisationsOf } from '../authorisations/ending.js';
import { checkFields, checkGrants, checkLastAdmin, type PersonState } from './people.guards.js';
import { present } from './people.present.js';
import * as repo from './people.repository.js';

export async function checkSitesExist(db: Executor, siteIds: string[]) {
  const unique = [...new Set(siteIds)];
  if ((await countSites(db, unique)) !== unique.length) throw unprocessable('siteId: no such site', { siteId: 'no such site' });
}

/**
 * PATCH /people/:id. Decided inside the transaction on the locked row, so a concurrent change cannot slip
 * between the check and the write; a refusal rolls everything back.
 */
export function makePersonUpdate(deps: Deps) {
  const { db, clock, audit } = deps;

  async function load(tx: Executor, id: string): Promise<PersonState> {
    const user = await repo.findUserById(tx, id, true);
    if (!user) throw notFound('That person');
    const [roles, coveredSiteIds] = await Promise.all([repo.rolesOf(tx, id), repo.coveredSitesOf(tx, id)]);
    return { user, roles, coveredSiteIds };
  }

  return async function update(actor: Actor, ability: AppAbility, id: string, body: UpdatePersonBody) {
    const fields = Object.keys(body);
    // Changes that could leave no admin lock the admins first (then the person), always in that order.
    const mayUnseatAdmin = body.active === false || !!body.accessEndsOn || body.roles !== undefined;
    await db.transaction(async (tx) => {
      const standing = mayUnseatAdmin ? await repo.lockStandingAdmins(tx) : [];
      const before = await load(tx, id);
      checkFields(actor, ability, before, body);
      checkGrants(actor, ability, before, body);
      if (body.siteId || body.coveredSiteIds) await checkSitesExist(tx, [body.siteId ?? before.user.siteId, ...(body.coveredSiteIds ?? [])]);
      if (body.active === false && !body.deactivatedReason) throw unprocessable('deactivatedReason: give a reason', { deactivatedReason: 'give a reason' });
      if (mayUnseatAdmin) checkLastAdmin(before, body, standing.filter((a) => a !== id));
      if (!fields.length) return;

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
      // A switched-off person's sessions are deleted, not merely refused, so switching them on again revives none.
      const sessionsEnded = body.active === false ? await deleteSessionsOf(tx, id) : undefined;
      await audit(tx, {
        actorId: actor.id, action: body.active === false ? 'person.deactivated' : 'person.updated', entity: 'user', entityId: id,
        oldValues: pick(present(before), fields), newValues: sessionsEnded === undefined ? body : { ...body, sessionsEnded },
      });
    });
  };
}

function pick(obj: Record<string, unknown>, keys: string[]) {
  return Object.fromEntries(keys.map((k) => [k, obj[k]]));
}
