import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { authorisationImportJobs } from '../db/schema/index.js';

export type ImportJobRow = typeof authorisationImportJobs.$inferSelect;

export async function insertImportJob(db: Executor, row: typeof authorisationImportJobs.$inferInsert): Promise<ImportJobRow> {
  const [job] = await db.insert(authorisationImportJobs).values(row).returning();
  return job;
}

export async function importJob(db: Executor, id: string, actorId?: string): Promise<ImportJobRow | undefined> {
  const [job] = await db.select().from(authorisationImportJobs)
    .where(actorId ? and(eq(authorisationImportJobs.id, id), eq(authorisationImportJobs.actorId, actorId)) : eq(authorisationImportJobs.id, id));
  return job;
}

/** Moves a job on: its own statement, outside the import's transaction, so the page sees it at once. */
export async function updateImportJob(db: Executor, id: string, set: Partial<typeof authorisationImportJobs.$inferInsert>): Promise<void> {
  await db.update(authorisationImportJobs).set(set).where(eq(authorisationImportJobs.id, id));
}
