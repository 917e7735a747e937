import { and, asc, count, desc, eq, inArray, lte, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { reminderSends, users } from '../db/schema/index.js';

export type SendRow = typeof reminderSends.$inferSelect;

// The holder and the active managers of the holder's site (their own site or one they cover).
const recipients = (holder: SQL) => sql`
  select ${holder}.id as id, 'holder'::text as role where ${holder}.active
  union
  select m.id, 'manager' from users m
  where m.active and m.id <> ${holder}.id
    and exists (select 1 from user_roles ur where ur.user_id = m.id and ur.role = 'manager')
    and (m.site_id = ${holder}.site_id or exists (select 1 from user_sites us where us.user_id = m.id and us.site_id = ${holder}.site_id))`;

const insertSend = sql`insert into reminder_sends (period_id, certificate_id, offset_days, recipient_id, recipient_role, due_at, status, attempts, next_attempt_at, created_at)`;

/**
 * Records the sends that are due: for each period (and certificate a running period rests on) the
 * nearest reminder offset reached, and a notice for what lapsed in the last 30 days. The unique key
 * makes a send that already exists a no-op, whichever process gets there first.
 */
export async function planSends(db: Executor, now: Date): Promise<number> {
  const t = sql`${now.toISOString()}::timestamptz`;
  // One statement at a time: on a transaction's connection, statements cannot overlap.
  const statements = [
    sql`${insertSend}
      select p.id, null, o.d, r.id, r.role, p.ends_at - make_interval(days => o.d), 'pending', 0, ${t}, ${t}
      from authorisation_periods p
      join scopes s on s.id = p.scope_id
      join users h on h.id = p.holder_id
      cross join lateral (select min(d) as d from unnest(s.reminder_offsets_days) d where p.ends_at - make_interval(days => d) <= ${t}) o
      cross join lateral (${recipients(sql`h`)}) r
      where p.starts_at <= ${t} and p.ends_at > ${t} and p.ends_at <= ${t} + interval '366 days' and o.d is not null
      on conflict do nothing`,
    sql`${insertSend}
      select p.id, null, 0, r.id, r.role, p.ends_at, 'pending', 0, ${t}, ${t}
      from authorisation_events e
      join authorisation_periods p on p.id = e.period_id
      join users h on h.id = p.holder_id
      cross join lateral (${recipients(sql`h`)}) r
      where e.kind = 'lapsed' and e.effective_at <= ${t} and e.effective_at > ${t} - interval '30 days'
      on conflict do nothing`,
    sql`${insertSend}
      select null, c.id, o.d, r.id, r.role, c.valid_until - make_interval(days => o.d), 'pending', 0, ${t}, ${t}
      from external_certificates c
      join users h on h.id = c.holder_id
      cross join lateral (
        select min(d) as d from authorisation_periods p
        join scopes s on s.id = p.scope_id
        join scope_requirements q on q.scope_id = s.id and q.kind = 'certificate' and q.certificate_kind = c.kind
        cross join unnest(s.reminder_offsets_days) d
        where p.holder_id = c.holder_id and p.starts_at <= ${t} and p.ends_at > ${t}
          and c.valid_until - make_interval(days => d) <= ${t}) o
      cross join lateral (${recipients(sql`h`)}) r
      where c.status = 'verified' and c.valid_until > ${t} and c.valid_until <= ${t} + interval '366 days' and o.d is not null
        and not exists (select 1 from external_certificates n where n.holder_id = c.holder_id and n.kind = c.kind and n.status = 'verified' and n.valid_until > c.valid_until)
      on conflict do nothing`,
    sql`${insertSend}
      select null, c.id, 0, r.id, r.role, c.valid_until, 'pending', 0, ${t}, ${t}
      from external_certificates c
      join users h on h.id = c.holder_id
      cross join lateral (${recipients(sql`h`)}) r
      where c.status = 'verified' and c.valid_until <= ${t} and c.valid_until > ${t} - interval '30 days'
        and not exists (select 1 from external_certificates n where n.holder_id = c.holder_id and n.kind = c.kind and n.status = 'verified' and n.valid_until > c.valid_until)
        and exists (select 1 from authorisation_periods p join scope_requirements q on q.scope_id = p.scope_id and q.kind = 'certificate' and q.certificate_kind = c.kind
          where p.holder_id = c.holder_id and p.starts_at <= ${t} and p.ends_at > ${t})
      on conflict do nothing`,
  ];
  const results = [];
  for (const statement of statements) results.push(await db.execute(statement));
  return results.reduce<number>((n, r) => n + ((r as unknown as { rowCount: number | null }).rowCount ?? 0), 0);
}

/**
 * Pending reminders about an end that has moved since they were planned (the due moment no longer
 * matches the period's end less the offset) are cancelled; planning records the new end's own.
 */
export async function cancelMoved(db: Executor): Promise<number> {
  const r = await db.execute(sql`update reminder_sends s set status = 'cancelled'
    from authorisation_periods p
    where s.period_id = p.id and s.status = 'pending' and s.offset_days > 0
      and s.due_at <> p.ends_at - make_interval(days => s.offset_days)`);
  return (r as unknown as { rowCount: number | null }).rowCount ?? 0;
}

/** Takes due sends no other worker holds: a send is in one worker's hands at a time, until its transaction ends. */
export async function claimDue(tx: Executor, now: Date, limit: number): Promise<SendRow[]> {
  return tx.select().from(reminderSends)
    .where(and(eq(reminderSends.status, 'pending'), lte(reminderSends.nextAttemptAt, now)))
    .orderBy(asc(reminderSends.nextAttemptAt), asc(reminderSends.id))
    .limit(limit)
    .for('update', { skipLocked: true });
}

export async function markSent(tx: Executor, id: string, mailId: string, now: Date) {
  await tx.update(reminderSends).set({ status: 'sent', sentAt: now, mailId, lastError: null }).where(eq(reminderSends.id, id));
}

export async function markFailed(tx: Executor, id: string, attempts: number, nextAttemptAt: Date, error: string) {
  await tx.update(reminderSends).set({ attempts, nextAttemptAt, lastError: error.slice(0, 1000) }).where(eq(reminderSends.id, id));
}

export async function cancelSend(tx: Executor, id: string) {
  await tx.update(reminderSends).set({ status: 'cancelled' }).where(eq(reminderSends.id, id));
}

export async function nextPendingAt(db: Executor): Promise<Date | null> {
  const [row] = await db.select({ at: sql<Date>`min(${reminderSends.nextAttemptAt})`.mapWith(reminderSends.nextAttemptAt) }).from(reminderSends).where(eq(reminderSends.status, 'pending'));
  return row?.at ?? null;
}

export async function recipientOf(db: Executor, id: string) {
  const [row] = await db.select({ id: users.id, name: users.name, email: users.email, active: users.active }).from(users).where(eq(users.id, id));
  return row;
}

export async function listSends(db: Executor, f: { siteIds: string[] | null; status?: string; page: number; pageSize: number }) {
  const conds: SQL[] = [];
  if (f.siteIds) conds.push(f.siteIds.length ? inArray(users.siteId, f.siteIds) : sql`false`);
  if (f.status) conds.push(eq(reminderSends.status, f.status));
  const where = and(...conds);
  const items = await db.select({ send: reminderSends, recipientName: users.name, recipientEmail: users.email }).from(reminderSends)
    .innerJoin(users, eq(users.id, reminderSends.recipientId)).where(where)
    .orderBy(desc(reminderSends.createdAt), desc(reminderSends.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(reminderSends).innerJoin(users, eq(users.id, reminderSends.recipientId)).where(where);
  return { items, total };
}
