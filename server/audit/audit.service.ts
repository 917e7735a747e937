import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { appendAudit } from './audit.repository.js';

export interface AuditInput {
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  oldValues?: unknown;
  newValues?: unknown;
}

export type Audit = (tx: Executor, entry: AuditInput) => Promise<void>;

export function makeAudit(clock: Clock): Audit {
  return (tx, entry) =>
    appendAudit(tx, {
      at: clock.now(),
      actorId: entry.actorId,
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId,
      oldValues: entry.oldValues ?? null,
      newValues: entry.newValues ?? null,
    });
}
