import { createHash } from 'node:crypto';
import { canonicalJson } from '../../shared/canonical.js';

export const GENESIS_HASH = '0'.repeat(64);

export interface AuditFields {
  at: Date;
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  oldValues: unknown;
  newValues: unknown;
}

/** The hash covers the entry's own fields and the hash of the entry before it. */
export function auditHash(prevHash: string, e: AuditFields): string {
  const text = canonicalJson({
    prevHash,
    at: e.at.toISOString(),
    actorId: e.actorId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId,
    oldValues: e.oldValues ?? null,
    newValues: e.newValues ?? null,
  });
  return createHash('sha256').update(text).digest('hex');
}
