import type { Deps } from '../deps.js';
import type { AuditTrailQuery } from '../../shared/schemas/audit-trail.js';
import type { AuditEntryView, ChainReportView } from '../../shared/register/views.js';
import { auditKey } from './audit.hash.js';
import { readAnchors } from './anchor.js';
import { verifyChain } from './audit.verify.js';
import { trailEntry, trailPage, type TrailRow } from './trail.repository.js';

const present = (r: TrailRow): AuditEntryView => ({ ...r, at: r.at.toISOString() });

/** The audit trail, read-only: filtered pages with old and new values, and the chain checked on request. */
export function makeTrailService({ db, clock, config }: Deps) {
  const key = auditKey(config.audit.key);

  async function page(q: AuditTrailQuery) {
    const { items, total, more } = await trailPage(db, { ...q, from: q.from ? new Date(q.from) : undefined, to: q.to ? new Date(q.to) : undefined }, q.page, q.pageSize);
    return { items: items.map(present), total, more, page: q.page, pageSize: q.pageSize };
  }

  /** Recomputes every seal on the server and holds the head against the anchors; names each issue and where. */
  async function verify(): Promise<ChainReportView> {
    const anchors = await readAnchors(config.audit.anchorDir, key);
    const r = await verifyChain(db, key, anchors);
    const issues = await Promise.all(r.issues.map(async (i) => {
      const entry = i.entryId ? await trailEntry(db, i.entryId) : undefined;
      return { ...i, entry: entry ? present(entry) : null };
    }));
    const lastAnchor = r.lastAnchor && { at: r.lastAnchor.at, id: r.lastAnchor.id, hmac: r.lastAnchor.hmac, line: r.lastAnchor.line };
    return { ...r, lastAnchor, issues, checkedAt: clock.now().toISOString() };
  }

  return { page, verify };
}
export type TrailService = ReturnType<typeof makeTrailService>;
