import { csvText } from '../csv.js';
import type { Deps } from '../deps.js';
import { subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import type { FindingBody, FindingsQuery } from '../../shared/schemas/findings.js';
import type { FindingView } from '../../shared/register/views.js';
import { conflict, forbidden, notFound, unprocessable } from '../errors.js';
import * as repo from './findings.repository.js';
import { findTarget } from './targets.repository.js';
import { FINDING_CSV_COLUMNS, findingCsvLine, presentFinding } from './findings.present.js';

export function makeFindingsService(deps: Deps) {
  const { db, clock, audit } = deps;

  async function get(id: string): Promise<FindingView> {
    const row = await repo.findFinding(db, id);
    if (!row) throw notFound('That finding');
    return presentFinding(row);
  }

  /** An auditor's finding about any record; the record must exist, and its site decides who answers. */
  async function raise(actor: Actor, body: FindingBody) {
    const target = await findTarget(db, body.entity, body.entityId);
    if (!target) throw unprocessable(`entityId: there is no such ${body.entity.replace('_', ' ')}`, { entityId: `no such ${body.entity.replace('_', ' ')}` });
    const now = clock.now();
    const created = await db.transaction(async (tx) => {
      const row = await repo.insertFinding(tx, {
        entity: body.entity, entityId: body.entityId, recordLabel: target.label, siteId: target.siteId, severity: body.severity, status: 'open',
        text: body.text, raisedBy: actor.id, raisedAt: now,
      });
      await audit(tx, { actorId: actor.id, action: 'finding.raised', entity: 'finding', entityId: row.id, newValues: { ...body, siteId: target.siteId } });
      return row;
    });
    return get(created.id);
  }

  /** Answer or close: only a manager of the record's site, only while it is not closed, in one transaction. */
  async function settle(actor: Actor, ability: AppAbility, id: string, kind: 'answer' | 'close', text: string) {
    const before = await repo.findFinding(db, id);
    if (!before) throw notFound('That finding');
    if (!ability.can('update', subjectOf('Finding', { siteId: before.finding.siteId }))) throw forbidden('Only a manager of the site this finding is about may answer or close it.');
    await db.transaction(async (tx) => {
      const row = (await repo.lockFinding(tx, id))!;
      if (row.status === 'closed') throw conflict('This finding is closed already.');
      const now = clock.now();
      const patch = kind === 'answer'
        ? { status: 'answered', response: text, answeredBy: actor.id, answeredAt: now }
        : { status: 'closed', closingNote: text, closedBy: actor.id, closedAt: now };
      await repo.updateFinding(tx, id, patch);
      const old = kind === 'answer' ? { status: row.status, response: row.response } : { status: row.status };
      await audit(tx, { actorId: actor.id, action: `finding.${kind === 'answer' ? 'answered' : 'closed'}`, entity: 'finding', entityId: id, oldValues: old, newValues: patch });
    });
    return get(id);
  }

  async function list(q: FindingsQuery) {
    const { items, total } = await repo.listFindings(db, q, q.page, q.pageSize);
    return { items: items.map(presentFinding), total, page: q.page, pageSize: q.pageSize };
  }

  /** Every finding matching the filter, newest first (up to 10,000), for the register's PDF and the CSV. */
  async function all(q: Omit<FindingsQuery, 'page' | 'pageSize'>): Promise<FindingView[]> {
    return (await repo.listFindings(db, q, 1, 10_000)).items.map(presentFinding);
  }

  async function csv(actor: Actor, q: Omit<FindingsQuery, 'page' | 'pageSize'>) {
    const rows = await all(q);
    const text = csvText([FINDING_CSV_COLUMNS, ...rows.map(findingCsvLine)]);
    await db.transaction((tx) => audit(tx, { actorId: actor.id, action: 'findings.exported', entity: 'finding', entityId: 'export', newValues: { format: 'csv', filter: q, rows: rows.length } }));
    return text;
  }

  return {
    get, raise, list, all, csv,
    answer: (actor: Actor, ability: AppAbility, id: string, response: string) => settle(actor, ability, id, 'answer', response),
    close: (actor: Actor, ability: AppAbility, id: string, note: string) => settle(actor, ability, id, 'close', note),
  };
}
export type FindingsService = ReturnType<typeof makeFindingsService>;
