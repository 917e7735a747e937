import { uuid } from '../../shared/schemas/common.js';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { ACKNOWLEDGED_MEANING, ASSESSED_MEANING, type Outcome } from '../../shared/schemas/practicals.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { reevaluatePerson } from '../authorisations/index.js';
import { failingItems } from '../records/items.present.js';
import * as repo from './practicals.repository.js';
import { recordablePractical } from './practicals.access.js';
import { checkAssessorStanding } from './assessor-standing.js';
import { practicalView } from './practicals.views.js';

export function makePracticalSigning(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;
  const view = async (id: string) => practicalView(db, signatures, (await repo.findPractical(db, id))!);

  /** The assessor's signature ("assessed"): competent only with every hold point witnessed and every item met. */
  async function assess(actor: Actor, ability: AppAbility, id: string, body: { outcome: Outcome; comment: string; password: string }) {
    const p = await recordablePractical(db, ability, id);
    if (body.outcome === 'competent') {
      const v = await practicalView(db, signatures, p);
      const fields: Record<string, string> = {
        ...Object.fromEntries(v.holdPoints.filter((h) => !h.witnessed).map((h) => [`holdPoints.${h.stepKey}`, `hold point ${h.number} ("${h.text}") is not witnessed`])),
        ...failingItems(v.items),
      };
      if (Object.keys(fields).length) throw unprocessable(`Not competent as recorded: ${Object.values(fields).join('; ')}`, { outcome: 'competent needs every hold point witnessed and every item met', ...fields });
    }
    await checkAssessorStanding(db, actor.id, p.scopeId, clock.now());
    const signer = await signatures.verify(actor.id, body.password);
    const now = clock.now();
    await db.transaction(async (tx) => {
      const locked = await recordablePractical(tx, ability, id, true);
      const signature = await signatures.record(tx, signer, { meaning: ASSESSED_MEANING, entity: 'practical', entityId: id });
      await repo.updatePractical(tx, id, { status: 'assessed', outcome: body.outcome, outcomeComment: body.comment, assessedAt: now, assessorSignatureId: signature.id, updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'practical.assessed', entity: 'practical', entityId: id, oldValues: { status: 'in_progress' }, newValues: { outcome: body.outcome, comment: body.comment, signatureId: signature.id } });
      // A signed correction replaces the record it corrects: what rested on that one is decided again.
      if (locked.correctsId) await reevaluatePerson(tx, locked.technicianId, { clock, audit, actorId: actor.id });
    });
    return view(id);
  }

  /**
   * The technician's signature ("outcome acknowledged"), on the assessor's device without the assessor
   * signing out: the technician names themselves and re-enters their own password.
   */
  async function acknowledge(actor: Actor, ability: AppAbility, id: string, body: { technician: string; password: string }) {
    const p = await repo.findPractical(db, id);
    if (!p) throw notFound('That practical');
    if (actor.id !== p.assessorId && actor.id !== p.technicianId) throw forbidden(ability.can('read', subjectOf('Practical', p)) ? 'The outcome is acknowledged on the assessor’s device or the technician’s own.' : 'You may not see this practical.');
    if (p.status === 'in_progress') throw conflict('The assessor signs the outcome first.', { status: p.status });
    if (p.status === 'acknowledged') throw conflict('The technician has already acknowledged this outcome.', { status: p.status });
    // The technician names themselves by id (any letter case, parsed to one spelling) or by e-mail.
    const asId = uuid().safeParse(body.technician);
    const named = asId.success ? asId.data : (await repo.findPersonByEmail(db, body.technician))?.id;
    if (named !== p.technicianId) throw forbidden('Only the technician assessed acknowledges the outcome, with their own e-mail and password.');
    const signer = await signatures.verify(p.technicianId, body.password);
    const now = clock.now();
    await db.transaction(async (tx) => {
      const locked = await repo.findPractical(tx, id, true);
      if (locked!.status !== 'assessed') throw conflict('The outcome is no longer waiting for acknowledgement.');
      const signature = await signatures.record(tx, signer, { meaning: ACKNOWLEDGED_MEANING, entity: 'practical', entityId: id });
      await repo.updatePractical(tx, id, { status: 'acknowledged', acknowledgedAt: now, technicianSignatureId: signature.id, updatedAt: now });
      await audit(tx, { actorId: p.technicianId, action: 'practical.acknowledged', entity: 'practical', entityId: id, oldValues: { status: 'assessed' }, newValues: { signatureId: signature.id, onSessionOf: actor.id } });
      // The completing event: a competent practical's last signature issues what rests on it, here.
      if (locked!.outcome === 'competent' || locked!.correctsId) await reevaluatePerson(tx, p.technicianId, { clock, audit, actorId: p.technicianId });
    });
    return view(id);
  }

  return { assess, acknowledge };
}
