import { and, eq, isNull, lt, or, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedureReviewReminders, procedures, procedureVersions, sites, userRoles, users, userSites } from '../db/schema/index.js';

/**
 * Published versions whose review falls due within `days` of today at the owning site, with every active
 * manager of that site (their own site or one they cover) and how many days are left.
 */
export async function reviewsDueWithin(db: Executor, now: Date, days: number) {
  const today = sql`(${now.toISOString()}::timestamptz at time zone ${sites.timeZone})::date`;
  const managesSite = sql`(${users.siteId} = ${procedures.siteId} or exists (select 1 from ${userSites} us where us.user_id = ${users.id} and us.site_id = ${procedures.siteId}))`;
  return db
    .select({
      versionId: procedureVersions.id, number: procedureVersions.number, title: procedureVersions.title, code: procedures.code,
      procedureId: procedures.id, reviewDueOn: sql<string>`${procedureVersions.reviewDueOn}::text`,
      daysLeft: sql<number>`(${procedureVersions.reviewDueOn} - ${today})::int`,
      managerId: users.id, managerName: users.name, managerEmail: users.email,
    })
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .innerJoin(sites, eq(sites.id, procedures.siteId))
    .innerJoin(userRoles, eq(userRoles.role, 'manager'))
    .innerJoin(users, and(eq(users.id, userRoles.userId), eq(users.active, true), managesSite))
    .where(and(eq(procedureVersions.status, 'published'), sql`${procedureVersions.reviewDueOn} <= ${today} + ${days}::int`))
    .orderBy(procedureVersions.reviewDueOn, procedures.code, users.name);
}

/** Records the reminders to be sent; one already recorded for the same (version, manager, offset) stays as it is. */
/** Records the reminders not yet recorded; returns how many were new. */
export async function recordReminders(db: Executor, rows: (typeof procedureReviewReminders.$inferInsert)[]): Promise<number> {
  if (!rows.length) return 0;
  const added = await db.insert(procedureReviewReminders).values(rows).onConflictDoNothing().returning({ id: procedureReviewReminders.id });
  return added.length;
}

/**
 * Claims unsent reminders for this run. A claim older than `staleBefore` is taken over (its sender died),
 * so a reminder is neither lost nor sent twice by two instances at once.
 */
export async function claimUnsent(db: Executor, now: Date, staleBefore: Date) {
  return db
    .update(procedureReviewReminders)
    .set({ claimedAt: now, attempts: sql`${procedureReviewReminders.attempts} + 1` })
    .where(and(isNull(procedureReviewReminders.sentAt), or(isNull(procedureReviewReminders.claimedAt), lt(procedureReviewReminders.claimedAt, staleBefore))))
    .returning();
}

export async function markSent(db: Executor, id: string, at: Date) {
  await db.update(procedureReviewReminders).set({ sentAt: at, lastError: null }).where(eq(procedureReviewReminders.id, id));
}

export async function markFailed(db: Executor, id: string, error: string) {
  await db.update(procedureReviewReminders).set({ claimedAt: null, lastError: error.slice(0, 1000) }).where(eq(procedureReviewReminders.id, id));
}

export async function reminderContext(db: Executor, versionId: string, managerId: string) {
  const [row] = await db
    .select({ code: procedures.code, procedureId: procedures.id, number: procedureVersions.number, title: procedureVersions.title, email: users.email, name: users.name })
    .from(procedureVersions)
    .innerJoin(procedures, eq(procedures.id, procedureVersions.procedureId))
    .innerJoin(users, eq(users.id, managerId))
    .where(eq(procedureVersions.id, versionId));
  return row;
}
