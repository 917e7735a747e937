import { desc, count, eq } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { mailLog } from '../db/schema/index.js';

export type MailLogInsert = typeof mailLog.$inferInsert;

export async function insertMailLog(db: Executor, row: MailLogInsert) {
  const [created] = await db.insert(mailLog).values(row).returning();
  return created;
}

export async function insertMailLogs(db: Executor, rows: MailLogInsert[]) {
  if (rows.length) await db.insert(mailLog).values(rows);
}

export async function listMailLog(db: Executor, page: number, pageSize: number) {
  const items = await db.select().from(mailLog).orderBy(desc(mailLog.createdAt)).limit(pageSize).offset((page - 1) * pageSize);
  const [{ total }] = await db.select({ total: count() }).from(mailLog);
  return { items, total };
}

export async function findMailLog(db: Executor, id: string) {
  const [row] = await db.select().from(mailLog).where(eq(mailLog.id, id));
  return row;
}
