import type { Executor } from '../db/client.js';
import type { Circuit, Outcome, PracticalStatus } from '../../shared/schemas/practicals.js';
import type { Expectations } from '../../shared/practicals/expectations.js';
import type { HoldPointView, PracticalView } from '../../shared/practicals/views.js';
import { findProcedure, findVersion } from '../procedures/procedures.repository.js';
import { presentSignature, type Signatures } from '../signatures/signatures.service.js';
import { checklistOf } from '../records/checklist.js';
import { loadSteps } from '../procedures/content.repository.js';
import { presentSteps } from './practicals.steps.js';
import { presentItems } from '../records/items.present.js';
import { instrumentLabels, peopleNames } from '../records/records.repository.js';
import { typeAcDecision } from '../benches/type-ac.repository.js';
import * as repo from './practicals.repository.js';
import { attemptsOf } from './attempts.repository.js';
import { withAttempts } from './attempts.present.js';

const iso = (d: Date | null) => d?.toISOString() ?? null;

/** Everything the bench screen shows, in a fixed handful of queries. */
export async function practicalView(db: Executor, signatures: Signatures, p: repo.PracticalRow): Promise<PracticalView> {
  const [procedure, version, checklist, entries, steps, witnessed, signed, bench, scope, correction, corrected, technician] = await Promise.all([
    findProcedure(db, p.procedureId), findVersion(db, p.procedureId, p.versionId), checklistOf(db, p.versionId, p.checklistId),
    repo.entriesOf(db, p.id), loadSteps(db, p.versionId), repo.witnessedOf(db, p.id), signatures.list(db, 'practical', [p.id]),
    repo.benchOf(db, p.benchId), p.scopeId ? repo.scopeBrief(db, p.scopeId) : undefined, repo.correctionOf(db, p.id),
    p.correctsId ? repo.findPractical(db, p.correctsId) : undefined, repo.personBrief(db, p.technicianId),
  ]);
  const tries = await attemptsOf(db, p.id);
  const decision = p.typeAcDecisionId ? await typeAcDecision(db, p.typeAcDecisionId) : null;
  const names = await peopleNames(db, [p.technicianId, p.assessorId, ...entries.map((e) => e.recordedBy), ...witnessed.map((w) => w.witnessedBy), ...tries.map((a) => a.recordedBy)]);
  const instruments = await instrumentLabels(db, [...new Set([...p.instrumentIds, ...entries.flatMap((e) => (e.instrumentId ? [e.instrumentId] : [])), ...tries.map((a) => a.instrumentId)])]);
  const expectations = p.expectations as Expectations;
  const listed = presentItems(checklist, entries, expectations.quantities, { names, instruments });
  const items = withAttempts(listed.items, tries, { names, instruments });
  const { progress } = listed;
  const byKey = new Map(witnessed.map((w) => [w.stepKey, w]));
  const holds = steps.map((s, position) => ({ ...s, position })).filter((s) => s.holdPoint);
  const holdPoints: HoldPointView[] = holds.map((s, i) => {
    const w = byKey.get(s.key);
    return { stepKey: s.key, position: s.position, number: i + 1, text: s.text, caution: s.caution, witnessed: w ? { at: w.witnessedAt.toISOString(), byName: names.get(w.witnessedBy) ?? 'unknown person', note: w.note, seq: w.seq } : null };
  });
  return {
    id: p.id, siteId: p.siteId, status: p.status as PracticalStatus,
    technician: { id: p.technicianId, name: technician?.name ?? 'unknown person', email: technician?.email ?? '' },
    assessor: { id: p.assessorId, name: names.get(p.assessorId) ?? 'unknown person' },
    bench: { id: bench!.id, code: bench!.code, name: bench!.name, supplyVoltage: bench!.supplyVoltage, supplyFrequency: bench!.supplyFrequency },
    scope: scope ?? null,
    procedure: { id: procedure!.id, code: procedure!.code, versionId: version!.id, number: version!.number, title: version!.title, inForce: version!.status === 'published' },
    checklist: { id: checklist.id, title: checklist.title, kind: checklist.kind },
    circuit: p.circuit as Circuit, expectations, items, progress, holdPoints, steps: presentSteps(steps, new Set(byKey.keys()), items),
    instruments: p.instrumentIds.map((id) => ({ id, label: instruments.get(id) ?? 'unknown instrument' })),
    signatures: signed.map(presentSignature),
    outcome: p.outcome as Outcome | null, outcomeComment: p.outcomeComment, crossSiteReason: p.crossSiteReason,
    typeAcDecision: decision && { byName: decision.decidedByName, at: decision.decidedAt, reason: decision.reason },
    heldAt: p.heldAt.toISOString(), assessedAt: iso(p.assessedAt), acknowledgedAt: iso(p.acknowledgedAt),
    corrects: corrected ? { id: corrected.id, reason: p.correctionReason, at: p.createdAt.toISOString() } : null,
    correctedBy: correction ? { id: correction.id, reason: correction.correctionReason, at: correction.createdAt.toISOString() } : null,
    createdAt: p.createdAt.toISOString(), updatedAt: p.updatedAt.toISOString(),
  };
}
