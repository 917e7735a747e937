import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedures, procedureVersions, sites, users } from '../db/schema/index.js';

export type ProcedureRow = typeof procedures.$inferSelect;
export type VersionRow = typeof procedureVersions.$inferSelect;
export type VersionInsert = typeof procedureVersions.$inferInsert;

export async function findProcedureByCode(db: Executor, code: string) {
  const [row] = await db.select().from(procedures).where(eq(procedures.code, code));
  return row;
}

/** With `lock`, the row is held until the transaction ends: transitions of one procedure queue here. */
export async function findProcedure(db: Executor, id: string, lock = false) {
  const q = db.select().from(procedures).where(eq(procedures.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function procedureWithSite(db: Executor, id: string) {
  const [row] = await db
    .select({ procedure: procedures, site: { id: sites.id, name: sites.name, code: sites.code, timeZone: sites.timeZone }, ownerName: users.name })
    .from(procedures)
    .innerJoin(sites, eq(sites.id, procedures.siteId))
    .innerJoin(users, eq(users.id, procedures.ownerId))
    .where(eq(procedures.id, id));
  return row;
}

export async function insertProcedure(db: Executor, row: typeof procedures.$inferInsert) {
  const [created] = await db.insert(procedures).values(row).returning();
  return created;
}

export async function touchProcedure(db: Executor, id: string, at: Date, by: string) {
  await db.update(procedures).set({ updatedAt: at, updatedBy: by }).where(eq(procedures.id, id));
}

export async function insertVersion(db: Executor, row: VersionInsert) {
  const [created] = await db.insert(procedureVersions).values(row).returning();
  return created;
}

export async function findVersion(db: Executor, procedureId: string, versionId: string) {
  const [row] = await db
    .select()
    .from(procedureVersions)
    .where(and(eq(procedureVersions.id, versionId), eq(procedureVersions.procedureId, procedureId)));
  return row;
}

export async function updateVersion(db: Executor, id: string, patch: Partial<VersionInsert>) {
  const [row] = await db.update(procedureVersions).set(patch).where(eq(procedureVersions.id, id)).returning();
  return row;
}

export async function versionsOf(db: Executor, procedureId: string) {
  return db.select().from(procedureVersions).where(eq(procedureVersions.procedureId, procedureId)).orderBy(desc(procedureVersions.number));
}

export async function publishedVersion(db: Executor, procedureId: string) {
  const [row] = await db
    .select()
    .from(procedureVersions)
    .where(and(eq(procedureVersions.procedureId, procedureId), eq(procedureVersions.status, 'published')));
  return row;
}

export async function openVersion(db: Executor, procedureId: string) {
  const [row] = await db
    .select()
    .from(procedureVersions)
    .where(and(eq(procedureVersions.procedureId, procedureId), inArray(procedureVersions.status, ['draft', 'in_review'])));
  return row;
}

export async function namesOf(db: Executor, ids: string[]) {
  if (!ids.length) return new Map<string, string>();
  const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids)).orderBy(asc(users.name));
  return new Map(rows.map((r) => [r.id, r.name]));
}
