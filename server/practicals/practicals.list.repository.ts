import { and, asc, count, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { benches, practicals, procedures, procedureVersions, users } from '../db/schema/index.js';
import { likePattern } from '../benches/sql.js';

const technician = alias(users, 'technician');
const assessor = alias(users, 'assessor');
const correction = alias(practicals, 'correction');

export interface PracticalFilter {
  access: SQL;
  mineId?: string;
  status?: string;
  outcome?: string;
  siteId?: string;
  q?: string;
  sort: 'heldAt' | 'status';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

const failed = sql<number>`(select count(*)::int from practical_entries e where e.practical_id = ${practicals.id} and e.verdict = 'fail')`;
// Every failed reading, also those taken again since: the list keeps the trace of a failure.
const failedAttempts = sql<number>`(select count(*)::int from practical_attempts a where a.practical_id = ${practicals.id} and a.verdict = 'fail')`;

export async function listPracticals(db: Executor, f: PracticalFilter) {
  const conds: SQL[] = [f.access];
  // "Mine": practicals I was assessed in or assessed.
  if (f.mineId) conds.push(or(eq(practicals.technicianId, f.mineId), eq(practicals.assessorId, f.mineId)) as SQL);
  if (f.status) conds.push(eq(practicals.status, f.status));
  if (f.outcome) conds.push(eq(practicals.outcome, f.outcome));
  if (f.siteId) conds.push(eq(practicals.siteId, f.siteId));
  if (f.q) conds.push(or(ilike(technician.name, likePattern(f.q)), ilike(procedures.code, likePattern(f.q)), ilike(benches.code, likePattern(f.q))) as SQL);
  const where = and(...conds);
  const col = { heldAt: practicals.heldAt, status: practicals.status }[f.sort];
  const items = await db
    .select({
      id: practicals.id, status: practicals.status, outcome: practicals.outcome, technicianName: technician.name, assessorName: assessor.name,
      benchCode: benches.code, procedureCode: procedures.code, versionNumber: procedureVersions.number, failed, failedAttempts, heldAt: practicals.heldAt,
      correctsId: practicals.correctsId, correctedById: correction.id,
    })
    .from(practicals)
    .innerJoin(technician, eq(technician.id, practicals.technicianId))
    .innerJoin(assessor, eq(assessor.id, practicals.assessorId))
    .innerJoin(benches, eq(benches.id, practicals.benchId))
    .innerJoin(procedures, eq(procedures.id, practicals.procedureId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, practicals.versionId))
    .leftJoin(correction, eq(correction.correctsId, practicals.id))
    .where(where)
    .orderBy(f.dir === 'asc' ? asc(col) : sql`${col} desc`, asc(practicals.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ n }] = await db
    .select({ n: count() })
    .from(practicals)
    .innerJoin(technician, eq(technician.id, practicals.technicianId))
    .innerJoin(benches, eq(benches.id, practicals.benchId))
    .innerJoin(procedures, eq(procedures.id, practicals.procedureId))
    .where(where);
  return { items, total: n };
}
