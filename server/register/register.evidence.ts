import type { Deps } from '../deps.js';
import { subjectOf, type AppAbility } from '../../shared/abilities.js';
import { EVENT_LABELS, type EventKind } from '../../shared/authorisations/kinds.js';
import type { RegisterRow, RowEvidenceView } from '../../shared/register/views.js';
import { accessibleWhere } from '../authz/casl-sql.js';
import { forbidden, notFound } from '../errors.js';
import { eventsOf, findAuthorisation, findPeriod } from '../authorisations/periods.repository.js';
import { namesOf, signaturesByIds } from '../authorisations/authorisations.repository.js';
import { findPerson } from '../authorisations/facts.repository.js';
import type { EvidenceSnapshot } from '../authorisations/snapshot.js';
import { registerAccessColumns, registerRows } from './register.repository.js';
import { filesOf, type FileMeta } from './evidence.repository.js';
import { resolveMoment } from './moment.js';
import { presentRow } from './register.present.js';
import type { Moment } from './state.sql.js';

const fileView = (f: FileMeta) => ({ id: f.id, fileName: f.fileName, mediaType: f.mediaType, sizeBytes: f.sizeBytes, sha256: f.sha256 });

/** What one register row rests on at the moment: the period's events then, and the evidence it was issued on. */
export function makeRowEvidence({ db, clock }: Deps) {
  async function rowAt(ability: AppAbility, authorisationId: string, m: Moment): Promise<RegisterRow> {
    const auth = await findAuthorisation(db, authorisationId);
    if (!auth) throw notFound('That authorisation');
    const holder = (await findPerson(db, auth.holderId))!;
    if (!ability.can('read', subjectOf('Register', { siteId: holder.siteId, personId: holder.id }))) throw forbidden('You may not see this authorisation in the register.');
    const access = accessibleWhere(ability, 'read', 'Register', registerAccessColumns);
    const [row] = await registerRows(db, { access, moment: m, authorisationIds: [authorisationId] }, 'person', 'asc', 1);
    if (!row) throw notFound('A period of that authorisation at that moment');
    return presentRow(row);
  }

  async function evidenceOf(ability: AppAbility, authorisationId: string, q: { at?: string; view: 'effective' | 'known' }): Promise<RowEvidenceView> {
    const m = resolveMoment(q, clock.now());
    const row = await rowAt(ability, authorisationId, m);
    const period = (await findPeriod(db, row.periodId))!;
    const events = (await eventsOf(db, [period.id], m.at)).filter((e) => !m.known || e.recordedAt <= m.at);
    const sigs = await signaturesByIds(db, events.map((e) => e.signatureId).filter((x): x is string => !!x));
    const names = await namesOf(db, events.map((e) => e.actorId).filter((x): x is string => !!x));
    const snap = period.evidenceSnapshot as EvidenceSnapshot;
    const refs = snap.requirements.flatMap((r) => r.evidence);
    const files = await filesOf(db, refs, m.at, period.priorEvidenceId ? [period.priorEvidenceId] : []);
    const filesFor = (type: string, id: string) => files.filter((f) => f.entity === type && f.entityId === id).map(fileView);
    return {
      ...m.info, row, evaluatedAt: snap.evaluatedAt,
      events: events.map((e) => ({
        kind: e.kind, label: EVENT_LABELS[e.kind as EventKind] ?? e.kind, effectiveAt: e.effectiveAt.toISOString(), recordedAt: e.recordedAt.toISOString(),
        reason: e.reason, actorName: e.actorId ? (names.get(e.actorId) ?? null) : null, signedBy: e.signatureId ? (sigs.get(e.signatureId)?.printedName ?? null) : null,
      })),
      basis: snap.requirements.map((r) => ({ kind: r.kind, label: r.label, met: r.met, detail: r.detail, evidence: r.evidence.map((e) => ({ ...e, files: filesFor(e.type, e.id) })) })),
      paperRecord: snap.paperRecord ? { ...snap.paperRecord, fileId: period.priorEvidenceId } : null,
    };
  }

  return { evidenceOf };
}
