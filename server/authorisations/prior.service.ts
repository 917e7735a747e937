import { randomUUID } from 'node:crypto';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { PRIOR_MEANING } from '../../shared/authorisations/kinds.js';
import type { PriorBody } from '../../shared/schemas/authorisations.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { forbidden, unprocessable } from '../errors.js';
import { findPerson, lockPerson } from './facts.repository.js';
import { scopesWithRequirements } from './scopes.repository.js';
import { evidenceOwner } from './certificates.repository.js';
import { reevaluatePerson } from './issuing.js';
import { priorProblems, writePrior } from './prior.js';
import { Writer } from './writer.js';

/** A manager records one authorisation held on paper before the portal, signing for the record. */
export function makePriorService(deps: Deps, signatures: Signatures) {
  const { db, clock } = deps;

  async function record(actor: Actor, ability: AppAbility, body: PriorBody) {
    const holder = await findPerson(db, body.holderId);
    if (!holder) throw unprocessable('holderId: no such person', { holderId: 'no such person' });
    if (!ability.can('create', subjectOf('Authorisation', { holderId: holder.id, siteId: holder.siteId }))) throw forbidden('You may record authorisations only for people at your sites.');
    if (holder.id === actor.id) throw forbidden('You may not record an authorisation for yourself.');
    const [scope] = await scopesWithRequirements(db, [body.scopeId]);
    if (!scope) throw unprocessable('scopeId: no such scope', { scopeId: 'no such scope' });
    const problem = priorProblems(holder, body, clock.now())[0];
    if (problem) throw unprocessable(`${problem[0]}: ${problem[1]}`, { [problem[0]]: problem[1] });
    if (body.evidenceId && (await evidenceOwner(db, body.evidenceId))?.ownerId !== holder.id) {
      throw unprocessable('evidenceId: no such upload among this person\'s files', { evidenceId: 'no such upload among this person\'s files' });
    }
    const signer = await signatures.verify(actor.id, body.password);
    return db.transaction(async (tx) => {
      await lockPerson(tx, holder.id);
      const w = new Writer(tx, { ...deps, actorId: actor.id }, clock.now());
      const periodId = randomUUID();
      const sig = await signatures.record(tx, signer, { meaning: PRIOR_MEANING, entity: 'authorisation_period', entityId: periodId });
      const st = await writePrior(tx, w, holder, scope, {
        issuedOn: body.issuedOn, expiresOn: body.expiresOn, attestedBy: body.attestedBy, evidenceId: body.evidenceId ?? null, note: body.note,
        origin: 'prior', signatureId: sig.id, periodId,
      });
      await reevaluatePerson(tx, holder.id, { ...deps, actorId: actor.id });
      return { authorisationId: st.authorisationId, periodId };
    });
  }

  return { record };
}
