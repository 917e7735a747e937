import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { APPROVAL_MEANING, type ChangeClass } from '../../shared/schemas/procedures.js';
import { isAtLeast, minimumChangeClass } from '../../shared/procedures/change-class.js';
import { addMonths } from '../../shared/procedures/dates.js';
import { localDate } from '../../shared/time.js';
import type { Executor } from '../db/client.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { conflict, forbidden, unprocessable } from '../errors.js';
import { loadContent, loadSteps } from './content.repository.js';
import { existingProcedure, existingVersion } from './procedures.access.js';
import { affectedPeople } from './procedures.impact.js';
import * as repo from './procedures.repository.js';
import { insertRequests } from './acknowledgements.repository.js';
import { versionView } from './procedures.views.js';
import type { RereadNotice } from './acknowledgements.service.js';

export function makeLifecycle(deps: Deps, signatures: Signatures, notify: (tx: Executor, notices: RereadNotice[]) => Promise<void>) {
  const { db, clock, audit, mailer } = deps;

  function requireStatus(v: repo.VersionRow, status: string, doing: string) {
    if (v.status !== status) throw conflict(`Version ${v.number} is ${v.status.replace('_', ' ')}; only a version ${status.replace('_', ' ')} can be ${doing}.`);
  }

  /** Four eyes: neither the author nor anyone who edited the draft may review it. */
  function refuseOwnWork(ability: AppAbility, actor: Actor, v: repo.VersionRow) {
    if (!ability.can('approve', subjectOf('Procedure', v)) || v.editorIds.includes(actor.id)) {
      throw forbidden('You wrote or edited this version: another manager must review it.');
    }
  }

  /** Completeness and the change class the steps require, checked on submission and again on approval. */
  async function checkReady(tx: Executor, v: repo.VersionRow) {
    const fields: Record<string, string> = {};
    const content = await loadContent(tx, v.id);
    if (!v.scope.trim()) fields.scope = 'describe the scope';
    if (!v.hazards.length) fields.hazards = 'name at least one hazard';
    if (!content.steps.length) fields.steps = 'add at least one step';
    if (!content.checklists.length) fields.checklists = 'add at least one checklist';
    if (v.number > 1) {
      if (!v.changeSummary) fields.changeSummary = 'summarise what changed';
      if (!v.changeClass) fields.changeClass = 'choose a change class';
      else if (v.basedOnId) {
        const check = minimumChangeClass(await loadSteps(tx, v.basedOnId), content.steps);
        if (!isAtLeast(v.changeClass as ChangeClass, check.minimum)) fields.changeClass = `must be at least ${check.minimum}: ${check.reasons.join(' ')}`;
      }
    }
    const first = Object.entries(fields)[0];
    if (first) throw unprocessable(`${first[0]}: ${first[1]}`, fields);
  }

  async function transition(actor: Actor, procedureId: string, versionId: string, work: (tx: Executor, v: repo.VersionRow) => Promise<repo.VersionRow>) {
    const row = await db.transaction(async (tx) => {
      await existingProcedure(tx, procedureId, true);
      const v = await existingVersion(tx, procedureId, versionId);
      const changed = await work(tx, v);
      await repo.touchProcedure(tx, procedureId, clock.now(), actor.id);
      return changed;
    });
    return versionView(db, clock, actor, row);
  }

  const submit = (actor: Actor, id: string, versionId: string) =>
    transition(actor, id, versionId, async (tx, v) => {
      requireStatus(v, 'draft', 'submitted');
      await checkReady(tx, v);
      const row = await repo.updateVersion(tx, v.id, { status: 'in_review', submittedAt: clock.now(), returnedAt: null, returnedBy: null, returnComment: null });
      await audit(tx, { actorId: actor.id, action: 'procedure.submitted', entity: 'procedure_version', entityId: v.id, oldValues: { status: v.status }, newValues: { status: row.status } });
      return row;
    });

  async function returnToDraft(actor: Actor, ability: AppAbility, id: string, versionId: string, comment: string) {
    refuseOwnWork(ability, actor, await existingVersion(db, id, versionId));
    return transition(actor, id, versionId, async (tx, v) => {
      requireStatus(v, 'in_review', 'returned');
      const row = await repo.updateVersion(tx, v.id, { status: 'draft', returnedAt: clock.now(), returnedBy: actor.id, returnComment: comment });
      await audit(tx, { actorId: actor.id, action: 'procedure.returned', entity: 'procedure_version', entityId: v.id, oldValues: { status: v.status }, newValues: { status: 'draft', comment } });
      return row;
    });
  }

  async function approve(actor: Actor, ability: AppAbility, id: string, versionId: string, password: string) {
    const before = await existingVersion(db, id, versionId);
    refuseOwnWork(ability, actor, before);
    requireStatus(before, 'in_review', 'approved');
    // A wrong password stops here, before anything is written.
    const signer = await signatures.verify(actor.id, password);
    const view = await transition(actor, id, versionId, async (tx, v) => {
      requireStatus(v, 'in_review', 'approved');
      await checkReady(tx, v);
      const now = clock.now();
      const { procedure, site } = (await repo.procedureWithSite(tx, id))!;
      const previous = await repo.publishedVersion(tx, id);
      const basedOn = v.basedOnId ? await existingVersion(tx, id, v.basedOnId) : null;
      if (previous) {
        await repo.updateVersion(tx, previous.id, { status: 'superseded', supersededAt: now });
        await audit(tx, { actorId: actor.id, action: 'procedure.superseded', entity: 'procedure_version', entityId: previous.id, oldValues: { status: 'published' }, newValues: { status: 'superseded', by: v.number } });
      }
      const signature = await signatures.record(tx, signer, { meaning: APPROVAL_MEANING, entity: 'procedure_version', entityId: v.id });
      const asks = v.number > 1 && v.changeClass !== 'editorial';
      const row = await repo.updateVersion(tx, v.id, {
        status: 'published', approvedBy: actor.id, approvalSignatureId: signature.id, publishedAt: now,
        reviewDueOn: addMonths(localDate(now, site.timeZone), v.reviewPeriodMonths),
        ackFromNumber: asks ? v.number : (basedOn?.ackFromNumber ?? v.number),
        assessFromNumber: v.changeClass === 're-assess' || v.number === 1 ? v.number : (basedOn?.assessFromNumber ?? v.number),
      });
      const people = await affectedPeople(tx, row, now);
      await insertRequests(tx, people.map((p) => ({
        procedureId: id, versionId: v.id, userId: p.userId, changeClass: v.changeClass!, dueOn: p.dueOn, createdAt: now,
      })));
      await audit(tx, {
        actorId: actor.id, action: 'procedure.published', entity: 'procedure_version', entityId: v.id,
        oldValues: { status: v.status }, newValues: { status: 'published', number: v.number, changeClass: v.changeClass, reviewDueOn: row.reviewDueOn, asked: people.map((p) => p.userId) },
      });
      await notify(tx, people.map((p) => ({ ...p, code: procedure.code, title: v.title, number: v.number, changeClass: v.changeClass as 're-read' | 're-assess', procedureId: id, versionId: v.id })));
      return row;
    });
    await mailer.wake();
    return view;
  }

  const withdraw = (actor: Actor, id: string, versionId: string, reason: string) =>
    transition(actor, id, versionId, async (tx, v) => {
      requireStatus(v, 'published', 'withdrawn');
      const row = await repo.updateVersion(tx, v.id, { status: 'withdrawn', withdrawnAt: clock.now(), withdrawnBy: actor.id, withdrawnReason: reason });
      await audit(tx, { actorId: actor.id, action: 'procedure.withdrawn', entity: 'procedure_version', entityId: v.id, oldValues: { status: v.status }, newValues: { status: 'withdrawn', reason } });
      return row;
    });

  return { submit, returnToDraft, approve, withdraw };
}
