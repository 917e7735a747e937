import { asc, eq, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedures, procedureVersions, scopeRequirements, scopes } from '../db/schema/index.js';

export type ScopeRow = typeof scopes.$inferSelect;
export type RequirementRow = typeof scopeRequirements.$inferSelect;
export type ScopeWithRequirements = ScopeRow & { requirements: RequirementRow[] };

/** Every scope with its requirements in two queries; scopes are few, so callers filter in memory. */
export async function scopesWithRequirements(db: Executor, ids?: string[]): Promise<ScopeWithRequirements[]> {
  if (ids && !ids.length) return [];
  const rows = await db.select().from(scopes).where(ids ? inArray(scopes.id, ids) : undefined).orderBy(asc(scopes.code));
  if (!rows.length) return [];
  const reqs = await db.select().from(scopeRequirements).where(inArray(scopeRequirements.scopeId, rows.map((r) => r.id))).orderBy(asc(scopeRequirements.position));
  return rows.map((s) => ({ ...s, requirements: reqs.filter((r) => r.scopeId === s.id) }));
}

export async function findScopeByCode(db: Executor, code: string) {
  const [row] = await db.select().from(scopes).where(eq(scopes.code, code));
  return row;
}

export async function insertScope(db: Executor, row: typeof scopes.$inferInsert) {
  const [created] = await db.insert(scopes).values(row).returning();
  return created;
}

export async function updateScope(db: Executor, id: string, patch: Partial<typeof scopes.$inferInsert>) {
  const [row] = await db.update(scopes).set(patch).where(eq(scopes.id, id)).returning();
  return row;
}

export async function lockScope(db: Executor, id: string) {
  const [row] = await db.select().from(scopes).where(eq(scopes.id, id)).for('update');
  return row;
}

export async function replaceRequirements(db: Executor, scopeId: string, rows: Omit<typeof scopeRequirements.$inferInsert, 'scopeId' | 'position'>[]) {
  await db.delete(scopeRequirements).where(eq(scopeRequirements.scopeId, scopeId));
  if (rows.length) await db.insert(scopeRequirements).values(rows.map((r, i) => ({ ...r, scopeId, position: i + 1 })));
}

/** Code and title of each procedure, from the version in force or else the newest version. */
export async function procedureNames(db: Executor, ids: string[]) {
  if (!ids.length) return new Map<string, { code: string; title: string }>();
  const rows = await db
    .selectDistinctOn([procedures.id], { id: procedures.id, code: procedures.code, title: procedureVersions.title })
    .from(procedures)
    .innerJoin(procedureVersions, eq(procedureVersions.procedureId, procedures.id))
    .where(inArray(procedures.id, ids))
    .orderBy(procedures.id, sql`(${procedureVersions.status} = 'published') desc`, sql`${procedureVersions.number} desc`);
  return new Map(rows.map((r) => [r.id, { code: r.code, title: r.title }]));
}

export async function existingProcedures(db: Executor, ids: string[]): Promise<Set<string>> {
  if (!ids.length) return new Set();
  const rows = await db.select({ id: procedures.id }).from(procedures).where(inArray(procedures.id, ids));
  return new Set(rows.map((r) => r.id));
}

export async function procedureIdsByCode(db: Executor, codes: string[]): Promise<Map<string, string>> {
  if (!codes.length) return new Map();
  const rows = await db.select({ id: procedures.id, code: procedures.code }).from(procedures).where(inArray(procedures.code, codes));
  return new Map(rows.map((r) => [r.code, r.id]));
}
