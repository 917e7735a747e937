import { and, count, desc, eq, gte, like, lte, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { auditLog, users } from '../db/schema/index.js';

export interface TrailFilter {
  actorId?: string;
  entity?: string;
  entityId?: string;
  action?: string;
  from?: Date;
  to?: Date;
}

function where(f: TrailFilter): SQL | undefined {
  const conds: SQL[] = [];
  if (f.actorId) conds.push(eq(auditLog.actorId, f.actorId));
  if (f.entity) conds.push(eq(auditLog.entity, f.entity));
  if (f.entityId) conds.push(eq(auditLog.entityId, f.entityId));
  // "authorisation." is every action of that kind; anything else is one action.
  if (f.action) conds.push(f.action.endsWith('.') ? like(auditLog.action, `${f.action}%`) : eq(auditLog.action, f.action));
  if (f.from) conds.push(gte(auditLog.at, f.from));
  if (f.to) conds.push(lte(auditLog.at, f.to));
  return conds.length ? and(...conds) : undefined;
}

const columns = {
  id: auditLog.id, at: auditLog.at, actorId: auditLog.actorId, actorName: users.name, action: auditLog.action, entity: auditLog.entity,
  entityId: auditLog.entityId, oldValues: auditLog.oldValues, newValues: auditLog.newValues,
};
export type TrailRow = { id: number; at: Date; actorId: string | null; actorName: string | null; action: string; entity: string; entityId: string; oldValues: unknown; newValues: unknown };

/** Newest first. The total is capped so a count over a long trail stays quick; `more` says it was. */
export async function trailPage(db: Executor, f: TrailFilter, page: number, pageSize: number, countCap = 100_000) {
  const w = where(f);
  const items: TrailRow[] = await db.select(columns).from(auditLog).leftJoin(users, eq(users.id, auditLog.actorId)).where(w)
    .orderBy(desc(auditLog.id)).limit(pageSize).offset((page - 1) * pageSize);
  const capped = db.select({ one: sql`1` }).from(auditLog).where(w).limit(countCap + 1).as('capped');
  const [{ n }] = await db.select({ n: count() }).from(capped);
  return { items, total: Math.min(n, countCap), more: n > countCap };
}

export async function trailEntry(db: Executor, id: number): Promise<TrailRow | undefined> {
  const [row] = await db.select(columns).from(auditLog).leftJoin(users, eq(users.id, auditLog.actorId)).where(eq(auditLog.id, id));
  return row;
}
