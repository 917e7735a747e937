import { CERTIFICATE_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import { formatDay, startOfLocalDay } from './dates.js';
import type { Evaluator } from './requirements.js';

/** A verified certificate of the kind, current now. The newest expiry is what a period may rest on. */
export const evaluateCertificate: Evaluator = (req, facts) => {
  const kind = req.certificateKind as CertificateKind;
  const name = CERTIFICATE_KIND_LABELS[kind] ?? kind;
  const label = `Current ${name} certificate`;
  const tz = facts.person.timeZone;
  const ofKind = facts.certificates.filter((c) => c.kind === kind);
  const verified = ofKind.filter((c) => c.status === 'verified').sort((a, b) => b.validUntil.getTime() - a.validUntil.getTime());
  const current = verified.filter((c) => c.validUntil > facts.now && startOfLocalDay(c.issuedOn, tz) <= facts.now);
  const base = { requirementId: req.id, kind: 'certificate' as const, label };
  if (current.length) {
    const best = current[0];
    return {
      ...base, met: true,
      detail: `${name} from ${best.issuer}, valid until ${formatDay(best.expiresOn)}.`,
      evidence: current.map((c) => ({ type: 'certificate' as const, id: c.id, label: `${name} from ${c.issuer}${c.reference ? ` (${c.reference})` : ''}, valid ${formatDay(c.issuedOn)} to ${formatDay(c.expiresOn)}`, at: c.reviewedAt! })),
      // The newest check counts as fresh evidence, even when an older certificate runs longer.
      metSince: new Date(Math.max(...current.map((c) => c.reviewedAt!.getTime()))), restsUntil: best.validUntil,
    };
  }
  const pending = ofKind.some((c) => c.status === 'submitted');
  const last = verified[0];
  const detail = pending
    ? `A ${name} certificate was uploaded and waits for a manager to check it.`
    : last
      ? `The ${name} certificate expired on ${formatDay(last.expiresOn)}: upload the renewed one.`
      : `Upload a current ${name} certificate for a manager to check.`;
  return { ...base, met: false, detail, evidence: [], metSince: null, restsUntil: last?.validUntil ?? null };
};
