import { and, asc, count, eq, ilike, ne, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { benches, procedureChecklists, procedures, procedureVersions, signoffs, users } from '../db/schema/index.js';
import { likePattern } from '../benches/sql.js';

const correction = alias(signoffs, 'correction');

export interface SignoffFilter {
  access: SQL;
  personId?: string;
  notPersonId?: string;
  status?: string;
  kind?: string;
  siteId?: string;
  q?: string;
  sort: 'updatedAt' | 'submittedAt' | 'status';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

// Items complete by the same reckoning as the record page: ticked, answered, uploaded, or measured and not failed.
const done = sql<number>`(select count(*)::int from signoff_entries e where e.signoff_id = ${signoffs.id}
  and (e.kind in ('text', 'evidence') or (e.kind = 'tick' and e.checked) or (e.kind = 'measurement' and e.verdict is distinct from 'fail')))`;
const total = sql<number>`(select count(*)::int from checklist_items i where i.checklist_id = ${signoffs.checklistId})`;

export async function listSignoffs(db: Executor, f: SignoffFilter) {
  const conds: SQL[] = [f.access];
  if (f.personId) conds.push(eq(signoffs.personId, f.personId));
  if (f.notPersonId) conds.push(ne(signoffs.personId, f.notPersonId));
  if (f.status) conds.push(eq(signoffs.status, f.status));
  if (f.kind) conds.push(eq(signoffs.kind, f.kind));
  if (f.siteId) conds.push(eq(signoffs.siteId, f.siteId));
  if (f.q) conds.push(or(ilike(users.name, likePattern(f.q)), ilike(procedures.code, likePattern(f.q))) as SQL);
  const where = and(...conds);
  const col = { updatedAt: signoffs.updatedAt, submittedAt: signoffs.submittedAt, status: signoffs.status }[f.sort];
  const items = await db
    .select({
      id: signoffs.id, kind: signoffs.kind, status: signoffs.status, personName: users.name, procedureCode: procedures.code,
      versionNumber: procedureVersions.number, checklistTitle: procedureChecklists.title, benchCode: benches.code, done, total,
      submittedAt: signoffs.submittedAt, updatedAt: signoffs.updatedAt, correctsId: signoffs.correctsId, correctedById: correction.id,
    })
    .from(signoffs)
    .innerJoin(users, eq(users.id, signoffs.personId))
    .innerJoin(procedures, eq(procedures.id, signoffs.procedureId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, signoffs.versionId))
    .innerJoin(procedureChecklists, eq(procedureChecklists.id, signoffs.checklistId))
    .leftJoin(benches, eq(benches.id, signoffs.benchId))
    .leftJoin(correction, eq(correction.correctsId, signoffs.id))
    .where(where)
    .orderBy(f.dir === 'asc' ? sql`${col} asc nulls last` : sql`${col} desc nulls last`, asc(signoffs.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ n }] = await db
    .select({ n: count() })
    .from(signoffs)
    .innerJoin(users, eq(users.id, signoffs.personId))
    .innerJoin(procedures, eq(procedures.id, signoffs.procedureId))
    .where(where);
  return { items, total: n };
}
