import type { Executor } from '../db/client.js';
import type { SignoffKind, SignoffStatus } from '../../shared/schemas/signoffs.js';
import type { SignoffView } from '../../shared/practicals/views.js';
import { findProcedure, findVersion } from '../procedures/procedures.repository.js';
import { presentSignature, type Signatures } from '../signatures/signatures.service.js';
import { checklistOf } from '../records/checklist.js';
import { presentItems } from '../records/items.present.js';
import { instrumentLabels, peopleNames } from '../records/records.repository.js';
import { benchBrief, correctionOf, entriesOf, findSignoff, type SignoffRow } from './signoffs.repository.js';

/** Everything the sign-off page shows, in a fixed handful of queries. */
export async function signoffView(db: Executor, signatures: Signatures, row: SignoffRow): Promise<SignoffView> {
  const [procedure, version, checklist, entries, signed, bench, correction, corrected] = await Promise.all([
    findProcedure(db, row.procedureId), findVersion(db, row.procedureId, row.versionId), checklistOf(db, row.versionId, row.checklistId),
    entriesOf(db, row.id), signatures.list(db, 'signoff', [row.id]), row.benchId ? benchBrief(db, row.benchId) : undefined,
    correctionOf(db, row.id), row.correctsId ? findSignoff(db, row.correctsId) : undefined,
  ]);
  const names = await peopleNames(db, [row.personId, ...entries.map((e) => e.recordedBy), ...(row.reviewedBy ? [row.reviewedBy] : [])]);
  const instruments = await instrumentLabels(db, entries.flatMap((e) => (e.instrumentId ? [e.instrumentId] : [])));
  const { items, progress } = presentItems(checklist, entries, null, { names, instruments });
  const reviewed = row.reviewedBy && row.reviewedAt;
  return {
    id: row.id, kind: row.kind as SignoffKind, status: row.status as SignoffStatus, siteId: row.siteId,
    person: { id: row.personId, name: names.get(row.personId) ?? 'unknown person' },
    procedure: { id: procedure!.id, code: procedure!.code, versionId: version!.id, number: version!.number, title: version!.title, inForce: version!.status === 'published' },
    checklist: { id: checklist.id, title: checklist.title, kind: checklist.kind },
    bench: bench ? { id: bench.id, code: bench.code, name: bench.name } : null,
    items, progress, signatures: signed.map(presentSignature),
    passed: row.passed, notes: row.notes, submittedAt: row.submittedAt?.toISOString() ?? null, benchCheckId: row.benchCheckId,
    review: reviewed
      ? { byName: names.get(row.reviewedBy!) ?? 'unknown person', at: row.reviewedAt!.toISOString(), comment: row.returnComment, outcome: row.status === 'returned' ? 'returned' : 'countersigned' }
      : null,
    corrects: corrected ? { id: corrected.id, reason: row.correctionReason, at: row.createdAt.toISOString() } : null,
    correctedBy: correction ? { id: correction.id, reason: correction.correctionReason, at: correction.createdAt.toISOString() } : null,
    createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString(),
  };
}
