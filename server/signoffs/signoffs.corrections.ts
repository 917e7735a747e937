import type { Deps } from '../deps.js';
import type { Actor, AppAbility } from '../../shared/abilities.js';
import { conflict, forbidden } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import * as repo from './signoffs.repository.js';
import { readableSignoff } from './signoffs.access.js';
import { signoffView } from './signoffs.views.js';

/**
 * A signed sign-off is never edited: its correction is a new one, opened with a reason, starting from a
 * copy of its entries, to be completed and signed again. Both stay visible, each pointing at the other.
 */
export function makeSignoffCorrections(deps: Deps, signatures: Signatures) {
  const { db, clock, audit } = deps;

  async function open(actor: Actor, ability: AppAbility, id: string, reason: string) {
    const old = await readableSignoff(db, ability, id);
    if (old.personId !== actor.id) throw forbidden('Only the person who signed a sign-off opens its correction.');
    if (old.status === 'in_progress') throw conflict('This sign-off is not signed yet: change it directly.');
    const existing = await repo.correctionOf(db, id);
    if (existing) throw conflict(`This sign-off already has a correction (${existing.id}); correct that one instead.`, { correctedById: existing.id });
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      await repo.findSignoff(tx, id, true);
      const row = await repo.insertSignoff(tx, {
        kind: old.kind, personId: old.personId, siteId: old.siteId, procedureId: old.procedureId, versionId: old.versionId, checklistId: old.checklistId,
        benchId: old.benchId, status: 'in_progress', correctsId: old.id, correctionReason: reason, createdAt: now, updatedAt: now,
      });
      await repo.copyEntries(tx, old.id, row.id);
      await audit(tx, { actorId: actor.id, action: 'signoff.correction_opened', entity: 'signoff', entityId: row.id, newValues: { correctsId: old.id, reason } });
      return row;
    });
    return signoffView(db, signatures, created);
  }

  return { open };
}
