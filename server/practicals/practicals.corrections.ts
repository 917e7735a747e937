import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { conflict, forbidden } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import * as repo from './practicals.repository.js';
import { copyAttempts } from './attempts.repository.js';
import { readablePractical } from './practicals.access.js';
import { practicalView } from './practicals.views.js';

/**
 * A signed practical is never edited. An assessor covering its site (never the technician) opens a
 * correction with a reason: a new practical of the same occasion, starting from a copy of what was
 * recorded, to be put right and signed again by both. The original stays visible and points to it.
 */
export function makePracticalCorrections(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;

  async function open(actor: Actor, ability: AppAbility, id: string, reason: string) {
    const old = await readablePractical(db, ability, id);
    if (!ability.can('create', subjectOf('Practical', { siteId: old.siteId, technicianId: old.technicianId }))) {
      throw forbidden(old.technicianId === actor.id ? 'An assessor never assesses themselves, corrections included.' : 'Only an assessor covering that site corrects its practicals.');
    }
    if (old.status === 'in_progress') throw conflict('This practical is not signed yet: change it directly.');
    const existing = await repo.correctionOf(db, id);
    if (existing) throw conflict(`This practical already has a correction (${existing.id}); correct that one instead.`, { correctedById: existing.id });
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      await repo.findPractical(tx, id, true);
      const row = await repo.insertPractical(tx, {
        technicianId: old.technicianId, assessorId: actor.id, siteId: old.siteId, benchId: old.benchId, procedureId: old.procedureId, versionId: old.versionId,
        checklistId: old.checklistId, scopeId: old.scopeId, instrumentIds: old.instrumentIds, circuit: old.circuit, expectations: old.expectations,
        status: 'in_progress', heldAt: old.heldAt, createdAt: now, updatedAt: now, correctsId: old.id, correctionReason: reason,
        crossSiteReason: old.crossSiteReason, typeAcDecisionId: old.typeAcDecisionId,
      });
      await repo.copyRecord(tx, old.id, row.id);
      await copyAttempts(tx, old.id, row.id);
      await audit(tx, { actorId: actor.id, action: 'practical.correction_opened', entity: 'practical', entityId: row.id, newValues: { correctsId: old.id, reason } });
      return row;
    });
    return practicalView(db, signatures, created);
  }

  return { open };
}
