import { and, count, desc, eq, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../db/client.js';
import { evidence, users } from '../db/schema/index.js';

export type EvidenceInsert = typeof evidence.$inferInsert;

const uploader = alias(users, 'uploader');

// Everything but the content: lists and metadata never read the stored bytes.
function selectMeta(db: Executor) {
  return db
    .select({
      id: evidence.id, ownerId: evidence.ownerId, ownerName: users.name, siteId: evidence.siteId, uploaderId: evidence.uploaderId,
      uploaderName: uploader.name, entity: evidence.entity, entityId: evidence.entityId, fileName: evidence.fileName,
      mediaType: evidence.mediaType, sizeBytes: evidence.sizeBytes, sha256: evidence.sha256, caption: evidence.caption, uploadedAt: evidence.uploadedAt,
    })
    .from(evidence)
    .innerJoin(users, eq(users.id, evidence.ownerId))
    .innerJoin(uploader, eq(uploader.id, evidence.uploaderId));
}
export type EvidenceMeta = Awaited<ReturnType<ReturnType<typeof selectMeta>['execute']>>[number];

export async function findMeta(db: Executor, id: string): Promise<EvidenceMeta | undefined> {
  const [row] = await selectMeta(db).where(eq(evidence.id, id));
  return row;
}

export async function contentOf(db: Executor, id: string): Promise<Buffer | undefined> {
  const [row] = await db.select({ content: evidence.content }).from(evidence).where(eq(evidence.id, id));
  return row?.content;
}

export async function insertEvidence(db: Executor, row: EvidenceInsert) {
  const [created] = await db.insert(evidence).values(row).returning({ id: evidence.id });
  return created;
}

export interface EvidenceFilter {
  access: SQL;
  ownerId?: string;
  entity?: string;
  entityId?: string;
  page: number;
  pageSize: number;
}

export async function listEvidence(db: Executor, f: EvidenceFilter) {
  const conds: SQL[] = [f.access];
  if (f.ownerId) conds.push(eq(evidence.ownerId, f.ownerId));
  if (f.entity) conds.push(eq(evidence.entity, f.entity));
  if (f.entityId) conds.push(eq(evidence.entityId, f.entityId));
  const where = and(...conds);
  const items = await selectMeta(db).where(where).orderBy(desc(evidence.uploadedAt), desc(evidence.id)).limit(f.pageSize).offset((f.page - 1) * f.pageSize);
  const [{ total }] = await db.select({ total: count() }).from(evidence).where(where);
  return { items, total };
}

/** The columns the CASL rules for Evidence speak about. */
export const evidenceAccessColumns = { ownerId: evidence.ownerId, siteId: evidence.siteId };
