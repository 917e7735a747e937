import { and, count, desc, eq, ilike, or, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { findings, sites, users } from '../db/schema/index.js';

export type FindingRow = typeof findings.$inferSelect;
export type FindingInsert = typeof findings.$inferInsert;

const raiser = alias(users, 'raiser');
const answerer = alias(users, 'answerer');
const closer = alias(users, 'closer');

export interface FindingsFilter {
  status?: string;
  severity?: string;
  siteId?: string;
  entity?: string;
  entityId?: string;
  q?: string;
}

function selectFull(db: Executor) {
  return db.select({ finding: findings, siteName: sites.name, raisedBy: raiser.name, answeredBy: answerer.name, closedBy: closer.name })
    .from(findings)
    .innerJoin(raiser, eq(raiser.id, findings.raisedBy))
    .leftJoin(sites, eq(sites.id, findings.siteId))
    .leftJoin(answerer, eq(answerer.id, findings.answeredBy))
    .leftJoin(closer, eq(closer.id, findings.closedBy));
}
export type FullFinding = Awaited<ReturnType<ReturnType<typeof selectFull>['execute']>>[number];

function where(f: FindingsFilter): SQL | undefined {
  const conds: SQL[] = [];
  if (f.status) conds.push(eq(findings.status, f.status));
  if (f.severity) conds.push(eq(findings.severity, f.severity));
  if (f.siteId) conds.push(eq(findings.siteId, f.siteId));
  if (f.entity) conds.push(eq(findings.entity, f.entity));
  if (f.entityId) conds.push(eq(findings.entityId, f.entityId));
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    conds.push(or(ilike(findings.text, like), ilike(findings.recordLabel, like)) as SQL);
  }
  return conds.length ? and(...conds) : undefined;
}

export async function listFindings(db: Executor, f: FindingsFilter, page: number, pageSize: number) {
  const items = await selectFull(db).where(where(f)).orderBy(desc(findings.raisedAt), desc(findings.id)).limit(pageSize).offset((page - 1) * pageSize);
  const [{ total }] = await db.select({ total: count() }).from(findings).where(where(f));
  return { items, total };
}

export async function findFinding(db: Executor, id: string): Promise<FullFinding | undefined> {
  const [row] = await selectFull(db).where(eq(findings.id, id));
  return row;
}

export async function lockFinding(db: Executor, id: string): Promise<FindingRow | undefined> {
  const [row] = await db.select().from(findings).where(eq(findings.id, id)).for('update');
  return row;
}

export async function insertFinding(db: Executor, row: FindingInsert) {
  const [created] = await db.insert(findings).values(row).returning();
  return created;
}

export async function updateFinding(db: Executor, id: string, patch: Partial<FindingInsert>) {
  await db.update(findings).set(patch).where(eq(findings.id, id));
}
