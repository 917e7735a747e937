import { createHmac, timingSafeEqual } from 'node:crypto';
import { canonicalJson } from '../../shared/canonical.js';

/** What the first seal links to: no entry (0) and no previous hmac. */
export const GENESIS = { id: 0, hmac: '0'.repeat(64) } as const;

export interface AuditFields {
  at: Date;
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  oldValues: unknown;
  newValues: unknown;
}

export type SealedFields = AuditFields & { id: number };

/** The audit key from its hex form (AUDIT_KEY or the key file). */
export const auditKey = (hex: string): Buffer => Buffer.from(hex, 'hex');

/**
 * HMAC-SHA-256 with the audit key over the entry's own fields, its id, the id of the entry sealed before
 * it and that entry's hmac: without the key no one can rebuild the chain, and the ids make a removed
 * entry show as a gap even where the sequence already had one (a rolled-back transaction).
 */
export function sealHmac(key: Buffer, prev: { id: number; hmac: string }, e: SealedFields): string {
  const text = canonicalJson({
    v: 1,
    id: e.id,
    prevId: prev.id,
    prevHmac: prev.hmac,
    at: e.at.toISOString(),
    actorId: e.actorId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    oldValues: e.oldValues ?? null,
    newValues: e.newValues ?? null,
  });
  return createHmac('sha256', key).update(text).digest('hex');
}

/** The HMAC of one anchor line's fields, so a line cannot be written or changed without the key. */
export function anchorMac(key: Buffer, at: string, id: number, hmac: string): string {
  return createHmac('sha256', key).update(`audit-anchor\t${at}\t${id}\t${hmac}`).digest('hex');
}

export function sameHex(a: string, b: string): boolean {
  return a.length === b.length && timingSafeEqual(Buffer.from(a), Buffer.from(b));
}
