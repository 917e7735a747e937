import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { REINSTATE_MEANING, REVOKE_MEANING, SUSPEND_MEANING } from '../../shared/authorisations/kinds.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { conflict, forbidden, notFound } from '../errors.js';
import { findAuthorisation } from './periods.repository.js';
import { findPerson, lockPerson } from './facts.repository.js';
import { reevaluatePerson } from './issuing.js';
import { standingOf } from './standing.js';
import { foldState } from './states.js';
import { Writer } from './writer.js';

export type ManagerAction = 'suspend' | 'reinstate' | 'revoke';

const MEANINGS: Record<ManagerAction, string> = { suspend: SUSPEND_MEANING, reinstate: REINSTATE_MEANING, revoke: REVOKE_MEANING };

/**
 * A manager suspends, reinstates or revokes with a reason and a signature (password checked before the
 * transaction, recorded inside it); what rests on the authorisation follows in the same transaction.
 */
export function makeActions(deps: Deps, signatures: Signatures) {
  const { db, clock } = deps;

  async function act(actor: Actor, ability: AppAbility, id: string, action: ManagerAction, body: { reason: string; password: string }) {
    const auth = await findAuthorisation(db, id);
    if (!auth) throw notFound('That authorisation');
    const holder = (await findPerson(db, auth.holderId))!;
    if (!ability.can('update', subjectOf('Authorisation', { holderId: holder.id, siteId: holder.siteId }))) throw forbidden('You may act only on authorisations of people at your sites.');
    if (holder.id === actor.id) throw forbidden('You may not suspend, reinstate or revoke your own authorisation.');
    check(action, await standingOf(db, id, clock.now()), clock.now());
    const signer = await signatures.verify(actor.id, body.password);
    return db.transaction(async (tx) => {
      await lockPerson(tx, holder.id);
      const now = clock.now();
      const st = check(action, await standingOf(tx, id, now), now);
      const sig = await signatures.record(tx, signer, { meaning: MEANINGS[action], entity: 'authorisation_period', entityId: st.period.id });
      const w = new Writer(tx, { ...deps, actorId: actor.id }, now);
      const signed = { actorId: actor.id, signatureId: sig.id, reason: body.reason, effectiveAt: now };
      if (action === 'suspend') await w.event(st, { kind: 'suspended', cause: 'manual', ...signed });
      if (action === 'reinstate') await w.event(st, { kind: 'reinstated', cause: 'manual', ...signed });
      if (action === 'revoke') {
        await w.event(st, { kind: 'revoked', ...signed });
        await w.moveEnd(st, now, 'Revoked.');
      }
      const cascade = await reevaluatePerson(tx, holder.id, { ...deps, actorId: actor.id });
      return { signatureId: sig.id, changes: [...w.changes, ...cascade] };
    });
  }

  return { act };
}

/** Only what makes sense now: 409 with the reason otherwise, before anything is signed. */
function check(action: ManagerAction, st: Awaited<ReturnType<typeof standingOf>>, now: Date) {
  if (!st || st.period.endsAt <= now) throw conflict('Nothing is in force for this authorisation now.');
  const s = foldState(st.period, st.events, now);
  const manual = s.holds.some((h) => h.cause === 'manual');
  if (action === 'suspend' && manual) throw conflict('It is already suspended by a manager.');
  if (action === 'reinstate' && !manual) {
    throw conflict(s.holds.length ? `It is suspended because: ${s.reason ?? 'what it rests on'}. That lifts by itself once put right.` : 'It is not suspended.');
  }
  return st;
}
