import { CERTIFICATE_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { EvaluationFacts } from './requirements.js';
import type { ScopeWithRequirements } from './scopes.repository.js';
import type { Standing } from './eligibility.js';
import { foldState, isSuspended } from './states.js';
import { addDays, formatDay, lastDay } from './dates.js';
import type { Writer } from './writer.js';

/**
 * Suspensions the server opens and lifts by itself: while a scope this one rests on is suspended, and
 * (live-work scopes) once a certificate it rests on has been expired for the grace period.
 */
export async function syncHolds(w: Writer, scope: ScopeWithRequirements, st: Standing, facts: EvaluationFacts) {
  for (const r of scope.requirements) {
    if (r.kind === 'prerequisite') await syncPrerequisite(w, st, facts, r.prerequisiteScopeId!);
    if (r.kind === 'certificate' && scope.allowsLiveWork) await syncCertificate(w, scope, st, facts, r.certificateKind as CertificateKind);
  }
}

const openHold = (st: Standing, now: Date, cause: string) => foldState(st.period, st.events, now).holds.find((h) => h.cause === cause);

async function syncPrerequisite(w: Writer, st: Standing, facts: EvaluationFacts, scopeId: string) {
  const cause = `prerequisite:${scopeId}`;
  const title = facts.scopes.get(scopeId)?.title ?? 'the scope it rests on';
  const other = facts.states.get(scopeId);
  const open = openHold(st, w.now, cause);
  if (!open && other && isSuspended(other)) {
    await w.event(st, { kind: 'suspended', cause, effectiveAt: w.now, reason: `“${title}”, which this rests on, is suspended.` });
  } else if (open && other?.state === 'active') {
    await w.event(st, { kind: 'reinstated', cause, effectiveAt: w.now, reason: `“${title}” is in force again.` });
  }
}

async function syncCertificate(w: Writer, scope: ScopeWithRequirements, st: Standing, facts: EvaluationFacts, kind: CertificateKind) {
  const cause = `certificate:${kind}`;
  const name = CERTIFICATE_KIND_LABELS[kind] ?? kind;
  const ofKind = facts.certificates.filter((c) => c.kind === kind);
  const verified = ofKind.filter((c) => c.status === 'verified');
  const valid = verified.filter((c) => c.validUntil > w.now);
  let open = openHold(st, w.now, cause);
  if (valid.length) {
    if (open) await w.event(st, { kind: 'restored', cause, effectiveAt: w.now, reason: `A renewed ${name} certificate was checked and accepted.`, details: { certificateId: valid[0].id } });
    return;
  }
  // A paper record with no certificate on file has nothing to lapse.
  if (!verified.length) return;
  const lastUntil = new Date(Math.max(...verified.map((c) => c.validUntil.getTime())));
  const suspendAt = addDays(lastUntil, scope.certificateGraceDays);
  if (!open && w.now >= suspendAt) {
    const grace = scope.certificateGraceDays ? ` and the ${scope.certificateGraceDays}-day grace period has ended` : '';
    const effectiveAt = suspendAt > st.period.startsAt ? suspendAt : st.period.startsAt;
    await w.event(st, { kind: 'suspended', cause, effectiveAt, reason: `The ${name} certificate expired on ${formatDay(lastDay(lastUntil, facts.person.timeZone))}${grace}.` });
    open = openHold(st, w.now, cause);
  }
  if (!open) return;
  const pending = ofKind.find((c) => c.status === 'submitted');
  if (pending && !open.renewalSubmitted) {
    await w.event(st, { kind: 'renewal_submitted', cause, effectiveAt: w.now, details: { certificateId: pending.id } });
  } else if (!pending && open.renewalSubmitted) {
    await w.event(st, { kind: 'suspended', cause, effectiveAt: w.now, reason: `The renewed ${name} certificate was not accepted; the suspension stands.` });
  }
}
