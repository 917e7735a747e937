import { and, desc, eq, inArray, lte } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { benches, benchTypeAcDecisions, procedureChecklists, procedures, procedureVersions, signoffs, users } from '../db/schema/index.js';

const reviewer = alias(users, 'reviewer');

/** The person's own sign-offs started by the moment, with procedure version, checklist and reviewer. */
export async function signoffsBy(db: Executor, personId: string, at: Date) {
  return db.select({
    id: signoffs.id, kind: signoffs.kind, status: signoffs.status, createdAt: signoffs.createdAt, submittedAt: signoffs.submittedAt,
    reviewedAt: signoffs.reviewedAt, returnComment: signoffs.returnComment, correctsId: signoffs.correctsId,
    code: procedures.code, number: procedureVersions.number, checklistTitle: procedureChecklists.title, reviewerName: reviewer.name,
  }).from(signoffs)
    .innerJoin(procedures, eq(procedures.id, signoffs.procedureId))
    .innerJoin(procedureVersions, eq(procedureVersions.id, signoffs.versionId))
    .innerJoin(procedureChecklists, eq(procedureChecklists.id, signoffs.checklistId))
    .leftJoin(reviewer, eq(reviewer.id, signoffs.reviewedBy))
    .where(and(eq(signoffs.personId, personId), eq(signoffs.kind, 'self-sign-off'), lte(signoffs.createdAt, at)))
    .orderBy(desc(signoffs.createdAt));
}

/** The Type AC decision standing for a bench at a moment: the newest made by then. */
export async function typeAcDecisionAt(db: Executor, benchId: string, at: Date) {
  const [row] = await db.select({ at: benchTypeAcDecisions.decidedAt, reason: benchTypeAcDecisions.reason, byName: users.name }).from(benchTypeAcDecisions)
    .innerJoin(users, eq(users.id, benchTypeAcDecisions.decidedBy))
    .where(and(eq(benchTypeAcDecisions.benchId, benchId), lte(benchTypeAcDecisions.decidedAt, at))).orderBy(desc(benchTypeAcDecisions.decidedAt), desc(benchTypeAcDecisions.id)).limit(1);
  return row ?? null;
}

/** What each practical was held on: procedure version, bench and the Type AC decision it carried. */
export async function practicalSettings(db: Executor, benchIds: string[], versionIds: string[], decisionIds: string[]) {
  const none = Promise.resolve([]);
  const [b, v, d] = await Promise.all([
    benchIds.length ? db.select({ id: benches.id, code: benches.code, name: benches.name, siteId: benches.siteId, supplyVoltage: benches.supplyVoltage, supplyFrequency: benches.supplyFrequency }).from(benches).where(inArray(benches.id, benchIds)) : none,
    versionIds.length ? db.select({ id: procedureVersions.id, code: procedures.code, number: procedureVersions.number, title: procedureVersions.title }).from(procedureVersions).innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId)).where(inArray(procedureVersions.id, versionIds)) : none,
    decisionIds.length ? db.select({ id: benchTypeAcDecisions.id, at: benchTypeAcDecisions.decidedAt, reason: benchTypeAcDecisions.reason, byName: users.name }).from(benchTypeAcDecisions).innerJoin(users, eq(users.id, benchTypeAcDecisions.decidedBy)).where(inArray(benchTypeAcDecisions.id, decisionIds)) : none,
  ]);
  return { benches: new Map(b.map((r) => [r.id, r])), versions: new Map(v.map((r) => [r.id, r])), decisions: new Map(d.map((r) => [r.id, r])) };
}
