import type { Deps } from '../deps.js';
import { rereadRuleFor } from '../../shared/procedures/reread-rule.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { ACKNOWLEDGEMENT_MEANING, type AckState, type AckTableQuery } from '../../shared/schemas/procedures.js';
import type { AckRowView } from '../../shared/procedures/reports.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { users } from '../db/schema/index.js';
import type { Executor } from '../db/client.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { presentSignature } from '../signatures/signatures.service.js';
import { findUserById } from '../people/people.repository.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import { existingProcedure, readableVersion } from './procedures.access.js';
import * as repo from './procedures.repository.js';
import * as acks from './acknowledgements.repository.js';
import { reevaluatePerson } from '../authorisations/index.js';

export interface RereadNotice {
  userId: string;
  name: string;
  email: string;
  dueOn: string;
  code: string;
  title: string;
  number: number;
  changeClass: 're-read' | 're-assess';
  procedureId: string;
  versionId: string;
}

export function makeAcknowledgements(deps: Deps, signatures: Signatures) {
  const { db, clock, audit, mailer, config } = deps;

  async function acknowledge(actor: Actor, ability: AppAbility, id: string, versionId: string, password: string) {
    const v = await readableVersion(db, ability, id, versionId);
    if (v.status !== 'published') throw conflict(`Version ${v.number} is not in force; only the published version can be acknowledged.`);
    if (await acks.findAcknowledgement(db, v.id, actor.id)) throw conflict(`You have already acknowledged version ${v.number}.`);
    const signer = await signatures.verify(actor.id, password);
    const signature = await db.transaction(async (tx) => {
      await existingProcedure(tx, id, true);
      const fresh = await repo.findVersion(tx, id, versionId);
      if (fresh?.status !== 'published') throw conflict(`Version ${v.number} was replaced a moment ago; open the version now in force.`);
      const sig = await signatures.record(tx, signer, { meaning: ACKNOWLEDGEMENT_MEANING, entity: 'procedure_version', entityId: v.id });
      const row = await acks.insertAcknowledgement(tx, { procedureId: id, versionId: v.id, versionNumber: v.number, userId: actor.id, signatureId: sig.id, acknowledgedAt: sig.signedAt });
      await audit(tx, { actorId: actor.id, action: 'procedure.acknowledged', entity: 'procedure_version', entityId: v.id, newValues: { acknowledgementId: row.id, number: v.number, signatureId: sig.id } });
      // An acknowledgement can be the last requirement of a scope: issue in this same transaction.
      await reevaluatePerson(tx, actor.id, { clock, audit, actorId: actor.id });
      return sig;
    });
    return { acknowledgement: presentSignature(signature) };
  }

  async function table(ability: AppAbility, id: string, q: AckTableQuery) {
    await existingProcedure(db, id);
    const published = await repo.publishedVersion(db, id);
    const access = accessibleWhere(ability, 'read', 'Acknowledgement', { userId: users.id, siteId: users.siteId });
    const version = published ? { id: published.id, ackFromNumber: published.ackFromNumber ?? published.number } : null;
    const { items, total } = await acks.acknowledgementTable(db, { ...q, procedureId: id, version, access, now: clock.now() });
    const rows: AckRowView[] = items.map((r) => ({
      userId: r.user_id, name: r.name, email: r.email, siteId: r.site_id, siteName: r.site_name, state: r.state as AckState,
      lastAcknowledgedNumber: r.last_number, lastAcknowledgedAt: r.last_at ? new Date(r.last_at).toISOString() : null,
      dueOn: r.due_on, requestClass: r.request_class as AckRowView['requestClass'], extensionReason: r.extension_reason,
    }));
    return { items: rows, total, page: q.page, pageSize: q.pageSize, inForce: published ? { versionId: published.id, number: published.number } : null };
  }

  async function extend(actor: Actor, ability: AppAbility, id: string, userId: string, body: { dueOn: string; reason: string }) {
    await existingProcedure(db, id);
    const person = await findUserById(db, userId);
    if (!person) throw notFound('That person');
    if (!ability.can('update', subjectOf('Acknowledgement', { userId, siteId: person.siteId }))) throw forbidden('You may extend deadlines only for people at your sites.');
    const published = await repo.publishedVersion(db, id);
    const request = published ? await acks.findRequest(db, published.id, userId) : undefined;
    if (!published || !request) throw notFound('A re-read asked of this person for the version in force');
    if (await acks.findAcknowledgement(db, published.id, userId)) throw conflict(`${person.name} has already acknowledged version ${published.number}.`);
    if (body.dueOn <= request.dueOn) throw unprocessable(`dueOn: choose a date after ${request.dueOn}`, { dueOn: `choose a date after ${request.dueOn}` });
    const updated = await db.transaction(async (tx) => {
      const locked = await acks.findRequest(tx, published.id, userId, true);
      const row = await acks.updateRequest(tx, locked!.id, { dueOn: body.dueOn, extendedAt: clock.now(), extendedBy: actor.id, extensionReason: body.reason });
      await audit(tx, { actorId: actor.id, action: 'procedure.reread_extended', entity: 'procedure_reread_request', entityId: row.id, oldValues: { dueOn: locked!.dueOn }, newValues: body });
      await reevaluatePerson(tx, userId, { clock, audit, actorId: actor.id });
      return row;
    });
    return { userId, dueOn: updated.dueOn, extensionReason: updated.extensionReason };
  }

  /**
   * One message per person, recorded in the publication's own transaction (`tx`): it goes out exactly
   * when the new version is in force, once per version and person, retried by the outbox until sent.
   */
  async function notify(tx: Executor, notices: RereadNotice[]) {
    await mailer.enqueueAll(tx, notices.map((n) => {
      const link = `${config.publicUrl}/procedures/${n.procedureId}/versions/${n.versionId}`;
      const assess = n.changeClass === 're-assess'
        ? '\nThis change also needs a new assessment: practicals done against earlier versions no longer count toward authorisations that need one. Arrange a supervised practical with an assessor.\n'
        : '';
      const text = `Hello ${n.name},\n\nVersion ${n.number} of ${n.code} "${n.title}" is now in force. It changes what you acknowledged before, so please read it and acknowledge it again by ${n.dueOn}.\n${assess}\nOpen it here:\n${link}\n\n${rereadRuleFor(null, n.number, n.dueOn)}\n`;
      return { key: `reread:${n.versionId}:${n.userId}`, to: n.email, subject: `Re-read ${n.code} version ${n.number} by ${n.dueOn}`, text, kind: `procedure-${n.changeClass}` };
    }));
  }

  return { acknowledge, table, extend, notify };
}
