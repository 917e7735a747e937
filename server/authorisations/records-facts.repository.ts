import { and, eq, inArray, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { practicals, procedureVersions, signoffs, users } from '../db/schema/index.js';

export interface RecordFact {
  id: string;
  /** Whose record it is. */
  personId: string;
  procedureId: string;
  versionNumber: number;
  /** When the work was done (practical held) or signed (sign-off submitted). */
  heldAt: Date;
  /** When the record got its last signature: what counts as fresh. */
  completedAt: Date;
  byName: string;
}

const assessor = alias(users, 'assessor');

/** The person's competent practicals with both signatures, except those replaced by a signed correction. */
export async function competentPracticals(db: Executor, userIds: string[], procedureIds: string[]): Promise<RecordFact[]> {
  if (!procedureIds.length || !userIds.length) return [];
  return db
    .select({
      id: practicals.id, personId: practicals.technicianId, procedureId: practicals.procedureId, versionNumber: procedureVersions.number, heldAt: practicals.heldAt,
      completedAt: sql<Date>`${practicals.acknowledgedAt}`.mapWith(practicals.acknowledgedAt), byName: assessor.name,
    })
    .from(practicals)
    .innerJoin(procedureVersions, eq(procedureVersions.id, practicals.versionId))
    .innerJoin(assessor, eq(assessor.id, practicals.assessorId))
    .where(and(
      inArray(practicals.technicianId, userIds), inArray(practicals.procedureId, procedureIds), eq(practicals.outcome, 'competent'), eq(practicals.status, 'acknowledged'),
      sql`not exists (select 1 from practicals c where c.corrects_id = ${practicals.id} and c.status <> 'in_progress')`,
    ));
}

/** The person's self sign-offs countersigned by an assessor, except those replaced by a signed correction. */
export async function countersignedSignoffs(db: Executor, userIds: string[], procedureIds: string[]): Promise<RecordFact[]> {
  if (!procedureIds.length || !userIds.length) return [];
  return db
    .select({
      id: signoffs.id, personId: signoffs.personId, procedureId: signoffs.procedureId, versionNumber: procedureVersions.number,
      heldAt: sql<Date>`${signoffs.submittedAt}`.mapWith(signoffs.submittedAt), completedAt: sql<Date>`${signoffs.reviewedAt}`.mapWith(signoffs.reviewedAt), byName: assessor.name,
    })
    .from(signoffs)
    .innerJoin(procedureVersions, eq(procedureVersions.id, signoffs.versionId))
    .innerJoin(assessor, eq(assessor.id, signoffs.reviewedBy))
    .where(and(
      inArray(signoffs.personId, userIds), inArray(signoffs.procedureId, procedureIds), eq(signoffs.kind, 'self-sign-off'), eq(signoffs.status, 'countersigned'),
      sql`not exists (select 1 from signoffs c where c.corrects_id = ${signoffs.id} and c.status not in ('in_progress', 'returned'))`,
    ));
}

/** The version in force's thresholds: from which number sign-offs (ackFrom) and practicals (assessFrom) count. */
export async function inForceThresholds(db: Executor, procedureIds: string[]) {
  if (!procedureIds.length) return new Map<string, { number: number; ackFrom: number; assessFrom: number }>();
  const rows = await db.select({ procedureId: procedureVersions.procedureId, number: procedureVersions.number, ackFrom: procedureVersions.ackFromNumber, assessFrom: procedureVersions.assessFromNumber })
    .from(procedureVersions).where(and(inArray(procedureVersions.procedureId, procedureIds), eq(procedureVersions.status, 'published')));
  return new Map(rows.map((r) => [r.procedureId, { number: r.number, ackFrom: r.ackFrom ?? r.number, assessFrom: r.assessFrom ?? 1 }]));
}
