import { and, eq, isNull } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { accountTokens, users } from '../db/schema/index.js';

export async function insertToken(db: Executor, row: typeof accountTokens.$inferInsert) {
  await db.insert(accountTokens).values(row);
}

export async function findTokenByHash(db: Executor, tokenHash: string, lock = false) {
  const q = db
    .select({ token: accountTokens, user: users })
    .from(accountTokens)
    .innerJoin(users, eq(users.id, accountTokens.userId))
    .where(eq(accountTokens.tokenHash, tokenHash));
  const [row] = lock ? await q.for('update', { of: accountTokens }) : await q;
  return row;
}

export async function markTokenUsed(db: Executor, id: string, at: Date) {
  await db.update(accountTokens).set({ usedAt: at }).where(eq(accountTokens.id, id));
}

/** A new link replaces the older unused ones of the same purpose. */
export async function retireOpenTokens(db: Executor, userId: string, purpose: 'invite' | 'reset', at: Date) {
  await db
    .update(accountTokens)
    .set({ usedAt: at })
    .where(and(eq(accountTokens.userId, userId), eq(accountTokens.purpose, purpose), isNull(accountTokens.usedAt)));
}
