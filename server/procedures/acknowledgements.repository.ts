import { and, eq, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedureAcknowledgements, procedureRereadRequests, sites, userRoles, users } from '../db/schema/index.js';

export type AckInsert = typeof procedureAcknowledgements.$inferInsert;

export async function insertAcknowledgement(db: Executor, row: AckInsert) {
  const [created] = await db.insert(procedureAcknowledgements).values(row).returning();
  return created;
}

export async function findAcknowledgement(db: Executor, versionId: string, userId: string) {
  const [row] = await db
    .select()
    .from(procedureAcknowledgements)
    .where(and(eq(procedureAcknowledgements.versionId, versionId), eq(procedureAcknowledgements.userId, userId)));
  return row;
}

/**
 * Everyone who acknowledged a version of the procedure numbered below `below` and is still active:
 * the people a re-read or re-assess version asks again.
 */
export async function earlierAcknowledgers(db: Executor, procedureId: string, below: number) {
  return db
    .select({
      userId: users.id, name: users.name, email: users.email, siteId: users.siteId, siteName: sites.name, timeZone: sites.timeZone,
      lastNumber: sql<number>`max(${procedureAcknowledgements.versionNumber})`,
    })
    .from(procedureAcknowledgements)
    .innerJoin(users, eq(users.id, procedureAcknowledgements.userId))
    .innerJoin(sites, eq(sites.id, users.siteId))
    .where(and(eq(procedureAcknowledgements.procedureId, procedureId), sql`${procedureAcknowledgements.versionNumber} < ${below}`, eq(users.active, true)))
    .groupBy(users.id, sites.id)
    .orderBy(users.name, users.id);
}

export async function insertRequests(db: Executor, rows: (typeof procedureRereadRequests.$inferInsert)[]) {
  if (!rows.length) return [];
  return db.insert(procedureRereadRequests).values(rows).returning();
}

export async function findRequest(db: Executor, versionId: string, userId: string, lock = false) {
  const q = db.select().from(procedureRereadRequests).where(and(eq(procedureRereadRequests.versionId, versionId), eq(procedureRereadRequests.userId, userId)));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function updateRequest(db: Executor, id: string, patch: Partial<typeof procedureRereadRequests.$inferInsert>) {
  const [row] = await db.update(procedureRereadRequests).set(patch).where(eq(procedureRereadRequests.id, id)).returning();
  return row;
}

export interface AckTableFilter {
  procedureId: string;
  /** The version in force, or null when none is. */
  version: { id: string; ackFromNumber: number } | null;
  /** Which people the reader may see, over users columns (from the ability). */
  access: SQL;
  now: Date;
  q?: string;
  siteId?: string;
  state?: string;
  page: number;
  pageSize: number;
}

/**
 * Each person's standing on one procedure: everyone who works at the bench (technicians and assessors)
 * and anyone who ever acknowledged it. The state is worked out in SQL so it can be filtered and paged.
 */
export async function acknowledgementTable(db: Executor, f: AckTableFilter) {
  const v = f.version;
  // users and sites keep their own names here: the access condition is written over their columns.
  const today = sql`(${f.now.toISOString()}::timestamptz at time zone ${sites.timeZone})::date`;
  const filters: SQL[] = [eq(users.active, true), f.access];
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    filters.push(sql`(${users.name} ilike ${like} or ${users.email} ilike ${like})`);
  }
  if (f.siteId) filters.push(eq(users.siteId, f.siteId));
  const mine = sql`a.procedure_id = ${f.procedureId} and a.user_id = ${users.id}`;
  const people = sql`
    select ${users.id} as user_id, ${users.name} as name, ${users.email} as email, ${users.siteId} as site_id, ${sites.name} as site_name,
      (select max(a.version_number) from ${procedureAcknowledgements} a where ${mine}) as last_number,
      (select max(a.acknowledged_at) from ${procedureAcknowledgements} a where ${mine}) as last_at,
      r.id as request_id, r.due_on::text as due_on, r.change_class as request_class, r.extension_reason, ${today} as today
    from ${users}
    join ${sites} on ${sites.id} = ${users.siteId}
    left join ${procedureRereadRequests} r on r.version_id = ${v?.id ?? null} and r.user_id = ${users.id}
    where ${sql.join(filters, sql` and `)}
      and (exists (select 1 from ${userRoles} ur where ur.user_id = ${users.id} and ur.role in ('technician', 'assessor'))
        or exists (select 1 from ${procedureAcknowledgements} a where ${mine}))`;
  const state = v
    ? sql`case when p.last_number >= ${v.ackFromNumber} then 'acknowledged'
        when p.request_id is not null and p.due_on::date < p.today then 'overdue'
        when p.request_id is not null then 're-read-due'
        when p.last_number is not null then 'older-version'
        else 'not-acknowledged' end`
    : sql`'not-in-force'`;
  const stateFilter = f.state ? sql`where t.state = ${f.state}` : sql``;
  const table = sql`select t.* from (select p.*, ${state} as state from (${people}) p) t ${stateFilter}`;
  type Rows<R> = { rows: R[] };
  const page = (await db.execute(sql`${table} order by t.name, t.user_id limit ${f.pageSize} offset ${(f.page - 1) * f.pageSize}`)) as unknown as Rows<AckTableRow>;
  const counted = (await db.execute(sql`select count(*)::int as total from (${table}) c`)) as unknown as Rows<{ total: number }>;
  return { items: page.rows, total: counted.rows[0].total };
}

export interface AckTableRow {
  user_id: string;
  name: string;
  email: string;
  site_id: string;
  site_name: string;
  last_number: number | null;
  last_at: Date | string | null;
  request_id: string | null;
  due_on: string | null;
  request_class: string | null;
  extension_reason: string | null;
  state: string;
}
