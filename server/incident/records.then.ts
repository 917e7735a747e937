import type { Executor } from '../db/client.js';
import type { RowEvidenceView } from '../../shared/register/views.js';
import { instrumentLabels } from '../records/records.repository.js';
import { filesOf, type FileMeta } from '../register/evidence.repository.js';
import { practicalSettings, signoffsBy, typeAcDecisionAt } from './records.repository.js';

type PracticalRow = { id: string; heldAt: Date; benchId: string; versionId: string; siteId: string; instrumentIds: string[]; crossSiteReason: string | null; typeAcDecisionId: string | null };

/** Sign-offs and practical settings as they stood at a moment, and what the pack shows was recorded later. */
export interface PackRecords {
  accountCreatedAt: Date;
  /** The Type AC decision standing then for the bench named for the pack, if any. */
  benchTypeAcDecision: { byName: string; at: Date; reason: string } | null;
  recordedLater: { scope: string; label: string; effectiveAt: Date; recordedAt: Date; paperAttestedBy: string | null }[];
  practicalSettings: { id: string; heldAt: Date; procedure: string; bench: string; instruments: string[]; crossSiteReason: string | null; typeAcDecision: { byName: string; at: Date; reason: string } | null }[];
  signoffs: { id: string; title: string; procedure: string; stateThen: string; startedAt: Date; submittedAt: Date | null; files: FileMeta[] }[];
}

export async function gatherRecords(db: Executor, at: Date, personId: string, accountCreatedAt: Date, practicals: PracticalRow[], authorisations: RowEvidenceView[], benchId?: string): Promise<PackRecords> {
  const s = await practicalSettings(db, [...new Set(practicals.map((p) => p.benchId))], [...new Set(practicals.map((p) => p.versionId))], practicals.flatMap((p) => (p.typeAcDecisionId ? [p.typeAcDecisionId] : [])));
  const labels = await instrumentLabels(db, [...new Set(practicals.flatMap((p) => p.instrumentIds))]);
  const practicalSettingsList = practicals.map((p) => {
    const b = s.benches.get(p.benchId);
    const v = s.versions.get(p.versionId);
    const d = p.typeAcDecisionId ? s.decisions.get(p.typeAcDecisionId) : undefined;
    return {
      id: p.id, heldAt: p.heldAt, procedure: v ? `${v.code} version ${v.number} ${v.title}` : 'unknown procedure version',
      bench: b ? `${b.code} ${b.name} (${b.supplyVoltage} V ${b.supplyFrequency} Hz)` : 'unknown bench',
      instruments: p.instrumentIds.map((id) => labels.get(id) ?? 'unknown instrument'), crossSiteReason: p.crossSiteReason,
      typeAcDecision: d ? { byName: d.byName, at: d.at, reason: d.reason } : null,
    };
  });

  const rows = await signoffsBy(db, personId, at);
  const files = await filesOf(db, rows.map((r) => ({ type: 'signoff', id: r.id })), at);
  const signoffs = rows.map((r) => ({
    id: r.id, title: r.checklistTitle, procedure: `${r.code} version ${r.number}`, startedAt: r.createdAt, submittedAt: r.submittedAt && r.submittedAt <= at ? r.submittedAt : null,
    files: files.filter((f) => f.entityId === r.id),
    stateThen: stateThen(r, at),
  }));

  const recordedLater = authorisations.flatMap((a) => a.events.filter((e) => new Date(e.recordedAt) > at).map((e) => ({
    scope: `${a.row.scope.code} ${a.row.scope.title}`, label: e.label, effectiveAt: new Date(e.effectiveAt), recordedAt: new Date(e.recordedAt),
    paperAttestedBy: a.paperRecord?.attestedBy ?? null,
  })));
  const benchTypeAcDecision = benchId ? await typeAcDecisionAt(db, benchId, at) : null;
  return { accountCreatedAt, benchTypeAcDecision, recordedLater, practicalSettings: practicalSettingsList, signoffs };
}

type SignoffRow = Awaited<ReturnType<typeof signoffsBy>>[number];
function stateThen(r: SignoffRow, at: Date): string {
  if (!r.submittedAt || r.submittedAt > at) return 'being filled in, not signed by then';
  if (!r.reviewedAt || r.reviewedAt > at) return 'signed by the technician, awaiting countersignature';
  return r.status === 'countersigned' ? `countersigned by ${r.reviewerName ?? 'an assessor'}` : `returned by ${r.reviewerName ?? 'an assessor'}${r.returnComment ? `: ${r.returnComment}` : ''}`;
}
