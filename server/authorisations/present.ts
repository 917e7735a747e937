import { CERTIFICATE_KIND_LABELS, EVENT_LABELS, PRIOR_LABEL, STATE_LABELS, type CertificateKind, type EventKind, type PeriodOrigin } from '../../shared/authorisations/kinds.js';
import type { AuthorisationSummary, CertificateView, EventView, PeriodView, RequirementResultView, RequirementView } from '../../shared/authorisations/views.js';
import { presentSignature } from '../signatures/signatures.service.js';
import type { SummaryRow } from './authorisations.repository.js';
import type { CertificateRow } from './certificates.repository.js';
import type { EventRow, PeriodRow } from './periods.repository.js';
import type { RequirementResult } from './requirements.js';
import type { RequirementRow } from './scopes.repository.js';
import type { DerivedState } from './states.js';
import { daysLeft, lastDay, localDate } from './dates.js';

export const isPriorOrigin = (origin: string) => origin === 'prior' || origin === 'imported';

export function presentSummary(row: SummaryRow, s: DerivedState, now: Date): AuthorisationSummary {
  const p = s.period;
  const running = s.state === 'active' || s.state === 'suspended' || s.state === 'renewal_submitted';
  return {
    id: row.id,
    holder: { id: row.holderId, name: row.holderName, siteId: row.siteId, siteName: row.siteName, timeZone: row.timeZone },
    scope: { id: row.scopeId, code: row.code, title: row.title, maxVoltageV: row.maxVoltageV, maxCurrentA: row.maxCurrentA, allowsLiveWork: row.allowsLiveWork },
    state: s.state, stateLabel: STATE_LABELS[s.state], since: s.since?.toISOString() ?? null, reason: s.reason, periodId: p?.id ?? null,
    validFrom: p ? localDate(p.startsAt, row.timeZone) : null,
    validUntil: p ? lastDay(p.endsAt, row.timeZone) : null,
    endsAt: p?.endsAt.toISOString() ?? null,
    daysLeft: p && running ? daysLeft(p.endsAt, now, row.timeZone) : null,
    recordedFromBefore: p ? isPriorOrigin(p.origin) : false,
  };
}

export function presentEvent(e: EventRow, names: Map<string, string>, sigs: Map<string, Parameters<typeof presentSignature>[0]>): EventView {
  const sig = e.signatureId ? sigs.get(e.signatureId) : undefined;
  return {
    id: e.id, kind: e.kind as EventKind, label: EVENT_LABELS[e.kind as EventKind], effectiveAt: e.effectiveAt.toISOString(), recordedAt: e.recordedAt.toISOString(),
    actorName: e.actorId ? (names.get(e.actorId) ?? null) : null, reason: e.reason, cause: e.cause, signature: sig ? presentSignature(sig) : null,
  };
}

export function presentPeriod(p: PeriodRow, events: EventView[], tz: string, names: Map<string, string>): PeriodView {
  const prior = isPriorOrigin(p.origin);
  return {
    id: p.id, origin: p.origin as PeriodOrigin, recordedFromBefore: prior, startsAt: p.startsAt.toISOString(), endsAt: p.endsAt.toISOString(),
    validFrom: localDate(p.startsAt, tz), validUntil: lastDay(p.endsAt, tz),
    issuedByName: p.issuedBy ? (names.get(p.issuedBy) ?? null) : null,
    attestedBy: prior ? `${p.attestedBy} (${PRIOR_LABEL.toLowerCase()})` : null, priorNote: p.priorNote, events,
  };
}

export function presentResult(r: RequirementResult): RequirementResultView {
  return {
    requirementId: r.requirementId, kind: r.kind, label: r.label, met: r.met, detail: r.detail,
    evidence: r.evidence.map((e) => ({ type: e.type, id: e.id, label: e.label, at: e.at.toISOString() })), restsUntil: r.restsUntil?.toISOString() ?? null,
  };
}

export function presentRequirement(r: RequirementRow, label: string): RequirementView {
  return {
    id: r.id, kind: r.kind as RequirementView['kind'], label, procedureId: r.procedureId, scopeId: r.prerequisiteScopeId,
    certificateKind: (r.certificateKind as CertificateKind | null) ?? null,
    practicalsCount: r.practicalsCount, practicalsWindowMonths: r.practicalsWindowMonths,
  };
}

export function presentCertificate(c: CertificateRow, extra: { holderName: string; siteName: string; reviewerName: string | null }, now: Date): CertificateView {
  const kind = c.kind as CertificateKind;
  return {
    id: c.id, holderId: c.holderId, holderName: extra.holderName, siteName: extra.siteName, kind, kindLabel: CERTIFICATE_KIND_LABELS[kind] ?? kind,
    issuer: c.issuer, reference: c.reference, issuedOn: c.issuedOn, expiresOn: c.expiresOn, expired: c.validUntil <= now, status: c.status as CertificateView['status'],
    submittedAt: c.submittedAt.toISOString(), reviewedAt: c.reviewedAt?.toISOString() ?? null, reviewerName: extra.reviewerName,
    rejectionReason: c.rejectionReason, evidenceId: c.evidenceId, checkedHow: c.checkedHow as CertificateView['checkedHow'],
    originalSeen: c.originalSeenWhere && c.originalSeenOn ? { where: c.originalSeenWhere, on: c.originalSeenOn } : null,
  };
}
