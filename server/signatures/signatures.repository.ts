import { and, asc, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { signatures } from '../db/schema/index.js';

export type SignatureRow = typeof signatures.$inferSelect;

export async function insertSignature(db: Executor, row: typeof signatures.$inferInsert) {
  const [created] = await db.insert(signatures).values(row).returning();
  return created;
}

export async function signaturesFor(db: Executor, entity: string, entityIds: string[]) {
  if (!entityIds.length) return [];
  return db.select().from(signatures).where(and(eq(signatures.entity, entity), inArray(signatures.entityId, entityIds))).orderBy(asc(signatures.signedAt));
}
