import { asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { sites } from '../db/schema/index.js';

export type SiteRow = typeof sites.$inferSelect;

export async function listSites(db: Executor) {
  return db.select().from(sites).orderBy(asc(sites.name));
}

export async function findSite(db: Executor, id: string) {
  const [row] = await db.select().from(sites).where(eq(sites.id, id));
  return row;
}

export async function countSites(db: Executor, ids: string[]) {
  if (!ids.length) return 0;
  return (await db.select({ id: sites.id }).from(sites).where(inArray(sites.id, ids))).length;
}

export async function insertSite(db: Executor, row: typeof sites.$inferInsert) {
  const [created] = await db.insert(sites).values(row).returning();
  return created;
}

export async function updateSite(db: Executor, id: string, patch: Partial<typeof sites.$inferInsert>) {
  const [updated] = await db.update(sites).set(patch).where(eq(sites.id, id)).returning();
  return updated;
}
