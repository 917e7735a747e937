import type { Deps } from '../deps.js';
import type { AuditTrailQuery } from '../../shared/schemas/audit-trail.js';
import type { AuditEntryView, ChainReportView } from '../../shared/register/views.js';
import { verifyChain } from './audit.verify.js';
import { trailEntry, trailPage, type TrailRow } from './trail.repository.js';

const present = (r: TrailRow): AuditEntryView => ({ ...r, at: r.at.toISOString() });

/** The audit trail, read-only: filtered pages with old and new values, and the chain recomputed on request. */
export function makeTrailService({ db, clock }: Deps) {
  async function page(q: AuditTrailQuery) {
    const { items, total, more } = await trailPage(db, { ...q, from: q.from ? new Date(q.from) : undefined, to: q.to ? new Date(q.to) : undefined }, q.page, q.pageSize);
    return { items: items.map(present), total, more, page: q.page, pageSize: q.pageSize };
  }

  /** Recomputes every hash from the first entry on the server; names the first entry that does not match. */
  async function verify(): Promise<ChainReportView> {
    const report = await verifyChain(db);
    const checkedAt = clock.now().toISOString();
    if (report.intact) return { ...report, checkedAt };
    const entry = await trailEntry(db, report.firstBadId);
    return { ...report, checkedAt, entry: entry ? present(entry) : null };
  }

  return { page, verify };
}
export type TrailService = ReturnType<typeof makeTrailService>;
