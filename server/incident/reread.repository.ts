import { and, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db/client.js';
import { procedureRereadRequests } from '../db/schema/index.js';
import { changesAfter } from './incident.repository.js';

/**
 * The re-read deadline asked of a person for each of these versions as it stood at the moment: an
 * extension recorded later is undone from the trail's old value.
 */
export async function rereadDeadlinesAt(db: Executor, userId: string, versionIds: string[], at: Date) {
  if (!versionIds.length) return new Map<string, string>();
  const rows = await db.select({ id: procedureRereadRequests.id, versionId: procedureRereadRequests.versionId, dueOn: procedureRereadRequests.dueOn }).from(procedureRereadRequests)
    .where(and(eq(procedureRereadRequests.userId, userId), inArray(procedureRereadRequests.versionId, versionIds)));
  const due = new Map(rows.map((r) => [r.id, r.dueOn]));
  for (const c of await changesAfter(db, 'procedure_reread_request', rows.map((r) => r.id), at)) {
    const old = (c.oldValues as { dueOn?: string } | null)?.dueOn;
    if (c.action === 'procedure.reread_extended' && old) due.set(c.entityId!, old);
  }
  return new Map(rows.map((r) => [r.versionId, due.get(r.id)!]));
}
