import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { EntryBody, OpenSignoffBody, SignoffListQuery } from '../../shared/schemas/signoffs.js';
import type { SignoffRowView } from '../../shared/practicals/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { forbidden, notFound, unprocessable } from '../errors.js';
import type { Signatures } from '../signatures/signatures.service.js';
import type { Usability } from '../benches/usability.service.js';
import { checklistInForce, checklistOf } from '../records/checklist.js';
import { buildEntry } from '../records/entry.js';
import * as repo from './signoffs.repository.js';
import { listSignoffs } from './signoffs.list.repository.js';
import { editableSignoff, readableSignoff } from './signoffs.access.js';
import { signoffView } from './signoffs.views.js';

export function makeSignoffsService(deps: Deps, signatures: Signatures, usability: Usability) {
  const { db, clock, audit } = deps;
  const view = async (id: string) => signoffView(db, signatures, (await repo.findSignoff(db, id))!);

  async function open(actor: Actor, ability: AppAbility, body: OpenSignoffBody) {
    const { checklist } = await checklistInForce(db, body.procedureId, body.versionId, body.checklistId, ['self-sign-off', 'bench-pre-use']);
    const kind = checklist.kind as 'self-sign-off' | 'bench-pre-use';
    let siteId = actor.siteId;
    if (kind === 'bench-pre-use') {
      if (!body.benchId) throw unprocessable('benchId: choose the bench this check is for', { benchId: 'choose the bench this check is for' });
      const bench = await repo.benchBrief(db, body.benchId);
      if (!bench) throw unprocessable('benchId: no such bench', { benchId: 'no such bench' });
      if (!ability.can('create', subjectOf('BenchCheck', { siteId: bench.siteId }))) throw forbidden('You may not record checks on this bench.');
      siteId = bench.siteId;
    } else if (body.benchId) {
      throw unprocessable('benchId: a self sign-off is not about a bench', { benchId: 'leave empty for a self sign-off' });
    }
    if (!ability.can('create', subjectOf('Signoff', { personId: actor.id, siteId }))) throw forbidden('You may not fill in sign-offs.');
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      const row = await repo.insertSignoff(tx, {
        kind, personId: actor.id, siteId, procedureId: body.procedureId, versionId: body.versionId, checklistId: checklist.id,
        benchId: body.benchId ?? null, status: 'in_progress', createdAt: now, updatedAt: now,
      });
      await audit(tx, { actorId: actor.id, action: 'signoff.opened', entity: 'signoff', entityId: row.id, newValues: { kind, ...body } });
      return row;
    });
    return view(created.id);
  }

  /** Each entry is saved as it is made, so a dropped connection loses nothing. */
  async function saveEntry(actor: Actor, ability: AppAbility, id: string, itemId: string, body: EntryBody) {
    const row = await editableSignoff(db, ability, id);
    const item = (await checklistOf(db, row.versionId, row.checklistId)).items.find((i) => i.id === itemId);
    if (!item) throw notFound('That checklist item');
    const now = clock.now();
    const fields = await buildEntry({
      db, usability, item, body, record: { entity: 'signoff', id, siteId: row.siteId }, quantities: null, assessing: false, at: now, actorId: actor.id,
    });
    await db.transaction(async (tx) => {
      await editableSignoff(tx, ability, id, true);
      await repo.saveEntry(tx, id, itemId, fields);
      await repo.updateSignoff(tx, id, { updatedAt: now });
      await audit(tx, { actorId: actor.id, action: 'signoff.entry_saved', entity: 'signoff', entityId: id, newValues: { itemId, ...fields, recordedAt: undefined } });
    });
    return view(id);
  }

  async function list(actor: Actor, ability: AppAbility, q: SignoffListQuery) {
    const access = accessibleWhere(ability, q.awaitingMe ? 'approve' : 'read', 'Signoff', repo.signoffAccessColumns);
    const awaiting = q.awaitingMe ? { status: 'submitted', kind: 'self-sign-off', notPersonId: actor.id } : {};
    const { items, total } = await listSignoffs(db, { ...q, access, personId: q.view === 'mine' && !q.awaitingMe ? actor.id : undefined, ...awaiting });
    const rows: SignoffRowView[] = items.map((r) => ({
      ...r, kind: r.kind as SignoffRowView['kind'], status: r.status as SignoffRowView['status'],
      submittedAt: r.submittedAt?.toISOString() ?? null, updatedAt: r.updatedAt.toISOString(),
    }));
    return { items: rows, total, page: q.page, pageSize: q.pageSize };
  }

  async function get(ability: AppAbility, id: string) {
    return signoffView(db, signatures, await readableSignoff(db, ability, id));
  }

  return { open, saveEntry, list, get, view };
}
export type SignoffsService = ReturnType<typeof makeSignoffsService>;
