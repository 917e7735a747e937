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

export type Audit = ((tx: Executor, entry: AuditInput) => Promise<void>) & {
  /** Set where the job queue runs: told after each append, so a seal run follows the commit soon. */
  onAppended?: (() => void) | null;
};

export function makeAudit(clock: Clock): Audit {
  const audit: Audit = async (tx, entry) => {
    await appendAudit(tx, {
      at: clock.now(),
      actorId: entry.actorId,
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId,
      oldValues: entry.oldValues ?? null,
      newValues: entry.newValues ?? null,
    });
    audit.onAppended?.();
  };
  audit.onAppended = null;
  return audit;
}
