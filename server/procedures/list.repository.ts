import { and, asc, count, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { procedureAcknowledgements, procedureRereadRequests, procedures, procedureVersions, sites, users } from '../db/schema/index.js';

export interface ProcedureListFilter {
  /** Which versions the reader may see, over procedure_versions columns (from the ability). */
  access: SQL;
  viewerId: string;
  now: Date;
  q?: string;
  status?: string;
  category?: string;
  overdue?: boolean;
  sort: 'code' | 'title' | 'updatedAt' | 'reviewDueOn';
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

const pub = alias(procedureVersions, 'pub');
const site = alias(sites, 'site');

/** One row per procedure the reader may see: its newest readable version, and the one in force. */
export async function listProcedures(db: Executor, f: ProcedureListFilter) {
  const head = db
    .select({
      id: procedureVersions.id, number: procedureVersions.number, status: procedureVersions.status,
      title: procedureVersions.title, category: procedureVersions.category,
    })
    .from(procedureVersions)
    .where(and(eq(procedureVersions.procedureId, procedures.id), f.access))
    .orderBy(desc(procedureVersions.number))
    .limit(1)
    .as('head');
  const siteToday = sql`(${f.now.toISOString()}::timestamptz at time zone ${site.timeZone})::date`;
  const overdue = sql<boolean>`coalesce(${pub.reviewDueOn} < ${siteToday}, false)`;
  const conds: (SQL | undefined)[] = [];
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    conds.push(or(ilike(procedures.code, like), ilike(head.title, like)));
  }
  if (f.status) conds.push(eq(head.status, f.status));
  if (f.category) conds.push(eq(head.category, f.category));
  if (f.overdue !== undefined) conds.push(f.overdue ? overdue : sql`not ${overdue}`);
  const where = and(...conds);

  const myAck = sql<number | null>`(select max(a.version_number) from ${procedureAcknowledgements} a where a.procedure_id = ${procedures.id} and a.user_id = ${f.viewerId})`;
  const myDue = sql<string | null>`(select r.due_on::text from ${procedureRereadRequests} r where r.version_id = ${pub.id} and r.user_id = ${f.viewerId})`;
  const sortCol = { code: procedures.code, title: head.title, updatedAt: procedures.updatedAt, reviewDueOn: pub.reviewDueOn }[f.sort];
  const items = await db.select({
    id: procedures.id, code: procedures.code, versionId: head.id, versionNumber: head.number, status: head.status,
    title: head.title, category: head.category, updatedAt: procedures.updatedAt,
    ownerName: sql<string>`(select o.name from ${users} o where o.id = ${procedures.ownerId})`,
    publishedVersionId: pub.id, publishedNumber: pub.number, reviewDueOn: pub.reviewDueOn, ackFromNumber: pub.ackFromNumber,
    reviewOverdue: overdue, myAckNumber: myAck, myDueOn: myDue,
  })
    .from(procedures)
    .innerJoinLateral(head, sql`true`)
    .innerJoin(site, eq(site.id, procedures.siteId))
    .leftJoin(pub, and(eq(pub.procedureId, procedures.id), eq(pub.status, 'published')))
    .where(where)
    .orderBy(f.dir === 'asc' ? sql`${sortCol} asc nulls last` : sql`${sortCol} desc nulls last`, asc(procedures.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() })
    .from(procedures)
    .innerJoinLateral(head, sql`true`)
    .innerJoin(site, eq(site.id, procedures.siteId))
    .leftJoin(pub, and(eq(pub.procedureId, procedures.id), eq(pub.status, 'published')))
    .where(where);
  return { items, total };
}
