import { and, eq, isNull, sql } from 'drizzle-orm';
import type { Delivered } from '../mail/mailer.js';
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

/** Records the reminders not yet recorded (one per version, manager and offset); returns how many were new. */
export async function recordReminders(db: Executor, rows: (typeof procedureReviewReminders.$inferInsert)[]): Promise<number> {
  if (!rows.length) return 0;
  const added = await db.insert(procedureReviewReminders).values(rows).onConflictDoNothing().returning({ id: procedureReviewReminders.id });
  return added.length;
}

/**
 * Takes the reminders not yet handed to the mail outbox, marking them as handed over (`claimed_at`); the
 * caller records their messages in the same transaction, so each is handed over once.
 */
export async function claimUnqueued(db: Executor, now: Date) {
  return db
    .update(procedureReviewReminders)
    .set({ claimedAt: now })
    .where(and(isNull(procedureReviewReminders.sentAt), isNull(procedureReviewReminders.claimedAt)))
    .returning();
}

/** Mirrors what became of each reminder's message (its outbox key is `review:<reminder id>`). */
export async function recordDelivery(db: Executor, outcomes: Delivered[]) {
  if (!outcomes.length) return;
  const rows = outcomes.map((o) => ({ id: o.key.slice('review:'.length), sent_at: o.status === 'sent' ? o.at.toISOString() : null, attempts: o.attempts, error: o.error }));
  await db.execute(sql`update procedure_review_reminders r set sent_at = x.sent_at, attempts = x.attempts, last_error = x.error
    from jsonb_to_recordset(${JSON.stringify(rows)}::jsonb) as x(id uuid, sent_at timestamptz, attempts int, error text)
    where r.id = x.id and r.sent_at is null`);
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
