import { and, count, desc, eq, inArray, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { evidence, externalCertificates, sites, users } from '../db/schema/index.js';

export type CertificateRow = typeof externalCertificates.$inferSelect;

export async function certificatesOf(db: Executor, holderIds: string[]): Promise<CertificateRow[]> {
  if (!holderIds.length) return [];
  return db.select().from(externalCertificates).where(inArray(externalCertificates.holderId, holderIds)).orderBy(desc(externalCertificates.validUntil));
}

export async function findCertificate(db: Executor, id: string, lock = false): Promise<CertificateRow | undefined> {
  const q = db.select().from(externalCertificates).where(eq(externalCertificates.id, id));
  const [row] = lock ? await q.for('update') : await q;
  return row;
}

export async function insertCertificate(db: Executor, row: typeof externalCertificates.$inferInsert) {
  const [created] = await db.insert(externalCertificates).values(row).returning();
  return created;
}

export async function updateCertificate(db: Executor, id: string, patch: Partial<typeof externalCertificates.$inferInsert>) {
  const [row] = await db.update(externalCertificates).set(patch).where(eq(externalCertificates.id, id)).returning();
  return row;
}

/** Who owns an uploaded file, to check that a certificate's scan is the holder's own. */
export async function evidenceOwner(db: Executor, id: string) {
  const [row] = await db.select({ ownerId: evidence.ownerId, fileName: evidence.fileName }).from(evidence).where(eq(evidence.id, id));
  return row;
}

const reviewer = alias(users, 'reviewer');

export interface CertificateFilter {
  access: SQL;
  holderId?: string;
  siteId?: string;
  status?: string;
  page: number;
  pageSize: number;
}

/** The columns the CASL rules for Certificate speak about. */
export const certificateAccessColumns = { holderId: externalCertificates.holderId, siteId: users.siteId };

export async function listCertificates(db: Executor, f: CertificateFilter) {
  const conds: SQL[] = [f.access];
  if (f.holderId) conds.push(eq(externalCertificates.holderId, f.holderId));
  if (f.siteId) conds.push(eq(users.siteId, f.siteId));
  if (f.status) conds.push(eq(externalCertificates.status, f.status));
  const where = and(...conds);
  const items = await db
    .select({
      certificate: externalCertificates, holderName: users.name, siteId: users.siteId, siteName: sites.name, timeZone: sites.timeZone,
      reviewerName: reviewer.name,
    })
    .from(externalCertificates)
    .innerJoin(users, eq(users.id, externalCertificates.holderId))
    .innerJoin(sites, eq(sites.id, users.siteId))
    .leftJoin(reviewer, eq(reviewer.id, externalCertificates.reviewedBy))
    .where(where)
    .orderBy(desc(externalCertificates.submittedAt), desc(externalCertificates.id))
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(externalCertificates).innerJoin(users, eq(users.id, externalCertificates.holderId)).where(where);
  return { items, total };
}
