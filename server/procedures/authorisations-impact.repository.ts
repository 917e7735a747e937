import { and, eq, gt, inArray, lte, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationPeriods, authorisations, scopeRequirements, scopes, users } from '../db/schema/index.js';

const RESTS_ON = ['procedure_ack', 'checklist_signoff', 'practicals'];

/**
 * Authorisations running at `now` whose scope requires something of this procedure: acknowledging it,
 * signing its checklists, or practicals done against it.
 */
export async function authorisationsRestingOn(db: Executor, procedureId: string, now: Date) {
  return db
    .select({
      authorisationId: authorisations.id, holderId: users.id, holderName: users.name, scopeCode: scopes.code, scopeTitle: scopes.title,
      requires: sql<string[]>`array_agg(distinct ${scopeRequirements.kind} order by ${scopeRequirements.kind})`,
      runsUntil: sql<Date>`max(${authorisationPeriods.endsAt})`,
    })
    .from(scopeRequirements)
    .innerJoin(scopes, eq(scopes.id, scopeRequirements.scopeId))
    .innerJoin(authorisations, eq(authorisations.scopeId, scopes.id))
    .innerJoin(authorisationPeriods, and(eq(authorisationPeriods.authorisationId, authorisations.id), lte(authorisationPeriods.startsAt, now), gt(authorisationPeriods.endsAt, now)))
    .innerJoin(users, eq(users.id, authorisations.holderId))
    .where(and(eq(scopeRequirements.procedureId, procedureId), inArray(scopeRequirements.kind, RESTS_ON)))
    .groupBy(authorisations.id, users.id, scopes.id)
    .orderBy(users.name, scopes.code);
}
