import { and, inArray, lte, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { evidence, externalCertificates } from '../db/schema/index.js';

export interface RecordRef {
  type: string;
  id: string;
}

export interface FileMeta {
  id: string;
  entity: string;
  entityId: string;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: Date;
}

// Record kinds whose files are kept with them (evidence.entity); a certificate points at its scan instead.
const KEPT_WITH = new Set(['practical', 'signoff', 'bench_check', 'person']);

const meta = {
  id: evidence.id, entity: evidence.entity, entityId: evidence.entityId, fileName: evidence.fileName, mediaType: evidence.mediaType,
  sizeBytes: evidence.sizeBytes, sha256: evidence.sha256, uploadedAt: evidence.uploadedAt,
};

/**
 * The files behind the given records that were uploaded by `at`, in two queries at most: files kept with
 * practicals, sign-offs and checks, and certificate scans (returned with entity 'certificate').
 */
export async function filesOf(db: Executor, refs: RecordRef[], at: Date, extraIds: string[] = []): Promise<FileMeta[]> {
  const kept = refs.filter((r) => KEPT_WITH.has(r.type));
  const certIds = [...new Set(refs.filter((r) => r.type === 'certificate').map((r) => r.id))];
  const conds: SQL[] = kept.map((r) => sql`(${evidence.entity} = ${r.type} and ${evidence.entityId} = ${r.id})`);
  if (extraIds.length) conds.push(inArray(evidence.id, extraIds));
  const direct = conds.length ? await db.select(meta).from(evidence).where(and(or(...conds), lte(evidence.uploadedAt, at))) : [];
  const scans = certIds.length
    ? await db.select({ ...meta, certificateId: externalCertificates.id }).from(externalCertificates)
      .innerJoin(evidence, sql`${evidence.id} = ${externalCertificates.evidenceId}`)
      .where(and(inArray(externalCertificates.id, certIds), lte(evidence.uploadedAt, at)))
    : [];
  return [...direct, ...scans.map(({ certificateId, ...f }) => ({ ...f, entity: 'certificate', entityId: certificateId }))];
}

export async function fileContents(db: Executor, ids: string[]): Promise<Map<string, Buffer>> {
  if (!ids.length) return new Map();
  const rows = await db.select({ id: evidence.id, content: evidence.content }).from(evidence).where(inArray(evidence.id, ids));
  return new Map(rows.map((r) => [r.id, r.content]));
}
