import { and, asc, desc, eq, gt, inArray, lte, or, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { auditLog, benchChecks, instruments, practicals, procedureAcknowledgements, procedures, procedureVersions, signatures, users } from '../db/schema/index.js';

const iso = (d: Date) => sql`${d.toISOString()}::timestamptz`;

/** Versions in force at the moment: published by then, and not yet superseded or withdrawn then. */
export async function versionsInForceAt(db: Executor, at: Date) {
  return db.select({
    procedureId: procedures.id, code: procedures.code, versionId: procedureVersions.id, number: procedureVersions.number, title: procedureVersions.title,
    publishedAt: procedureVersions.publishedAt, changeClass: procedureVersions.changeClass, ackFromNumber: procedureVersions.ackFromNumber,
  }).from(procedureVersions).innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .where(and(
      lte(procedureVersions.publishedAt, at),
      sql`(${procedureVersions.supersededAt} is null or ${procedureVersions.supersededAt} > ${iso(at)})`,
      sql`(${procedureVersions.withdrawnAt} is null or ${procedureVersions.withdrawnAt} > ${iso(at)})`,
    )).orderBy(asc(procedures.code));
}

/** A person's acknowledgements made by the moment (every one, newest first), with the printed name signed. */
export async function acknowledgementsBy(db: Executor, userId: string, at: Date) {
  return db.select({
    id: procedureAcknowledgements.id, procedureId: procedureAcknowledgements.procedureId, code: procedures.code, versionId: procedureAcknowledgements.versionId,
    versionNumber: procedureAcknowledgements.versionNumber, acknowledgedAt: procedureAcknowledgements.acknowledgedAt, printedName: signatures.printedName, meaning: signatures.meaning,
  }).from(procedureAcknowledgements)
    .innerJoin(procedures, eq(procedures.id, procedureAcknowledgements.procedureId))
    .innerJoin(signatures, eq(signatures.id, procedureAcknowledgements.signatureId))
    .where(and(eq(procedureAcknowledgements.userId, userId), lte(procedureAcknowledgements.acknowledgedAt, at)))
    .orderBy(desc(procedureAcknowledgements.acknowledgedAt));
}

/** The bench's latest pre-use check recorded by the moment, with who did it. */
export async function latestCheckBefore(db: Executor, benchId: string, at: Date) {
  const [row] = await db.select({ check: benchChecks, personName: users.name }).from(benchChecks).innerJoin(users, eq(users.id, benchChecks.personId))
    .where(and(eq(benchChecks.benchId, benchId), lte(benchChecks.at, at))).orderBy(desc(benchChecks.at), desc(benchChecks.seq)).limit(1);
  return row;
}

/** Changes recorded after the moment to these records, newest first: undone in turn, they give what stood then. */
export async function changesAfter(db: Executor, entity: string, ids: string[], at: Date) {
  if (!ids.length) return [];
  return db.select({ id: auditLog.id, entityId: auditLog.entityId, action: auditLog.action, oldValues: auditLog.oldValues })
    .from(auditLog).where(and(eq(auditLog.entity, entity), inArray(auditLog.entityId, ids), gt(auditLog.at, at))).orderBy(desc(auditLog.id));
}

/** Instruments at a site, and any others named (those used in practicals), as they are recorded today. */
export async function instrumentsFor(db: Executor, siteId: string | null, ids: string[]) {
  const conds = [siteId ? eq(instruments.siteId, siteId) : sql`false`, ids.length ? inArray(instruments.id, ids) : sql`false`];
  return db.select().from(instruments).where(or(...conds)).orderBy(asc(instruments.kind), asc(instruments.serial));
}

/** The person's practicals held by the moment, with the assessor's name and the bench. */
export async function practicalsBy(db: Executor, technicianId: string, at: Date) {
  return db.select({ practical: practicals, assessorName: users.name }).from(practicals).innerJoin(users, eq(users.id, practicals.assessorId))
    .where(and(eq(practicals.technicianId, technicianId), lte(practicals.heldAt, at))).orderBy(desc(practicals.heldAt));
}
