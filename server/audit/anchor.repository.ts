import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { userRoles, users } from '../db/schema/index.js';

/** Active admins, who receive the daily anchor. */
export async function adminAddresses(db: Executor): Promise<{ id: string; email: string }[]> {
  return db.select({ id: users.id, email: users.email }).from(users).innerJoin(userRoles, eq(userRoles.userId, users.id))
    .where(and(eq(userRoles.role, 'admin'), eq(users.active, true))).orderBy(users.email);
}
