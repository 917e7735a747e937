// Words and lists shared by the server and the client for scopes, authorisations and certificates.

export const REQUIREMENT_KINDS = ['procedure_ack', 'checklist_signoff', 'practicals', 'prerequisite', 'certificate'] as const;
export type RequirementKind = (typeof REQUIREMENT_KINDS)[number];

/** Kinds a scope may list: every kind has an evaluator over the records it rests on. */
export const ACCEPTED_REQUIREMENT_KINDS = REQUIREMENT_KINDS;
export type AcceptedRequirementKind = RequirementKind;

export const REQUIREMENT_KIND_LABELS: Record<RequirementKind, string> = {
  procedure_ack: 'Procedure acknowledged (version in force)',
  checklist_signoff: 'Checklist signed off',
  practicals: 'Competent supervised practicals',
  prerequisite: 'Another scope held',
  certificate: 'Current external certificate',
};

export const CERTIFICATE_KINDS = ['first_aid_cpr', 'first_aid', 'cpr_aed', 'release_from_live_parts', 'electrical_qualification'] as const;
export type CertificateKind = (typeof CERTIFICATE_KINDS)[number];
export const CERTIFICATE_KIND_LABELS: Record<CertificateKind, string> = {
  first_aid_cpr: 'First aid and CPR',
  first_aid: 'First aid',
  cpr_aed: 'CPR and defibrillator (AED)',
  release_from_live_parts: 'Releasing a person from live parts',
  electrical_qualification: 'Electrical trade qualification',
};

export const CERTIFICATE_STATUSES = ['submitted', 'verified', 'rejected'] as const;
export type CertificateStatus = (typeof CERTIFICATE_STATUSES)[number];

/** What the server derives for one person and scope at a moment. */
export const AUTHORISATION_STATES = ['active', 'suspended', 'renewal_submitted', 'revoked', 'lapsed', 'ended', 'none'] as const;
export type AuthorisationState = (typeof AUTHORISATION_STATES)[number];
export const STATE_LABELS: Record<AuthorisationState, string> = {
  active: 'In force',
  suspended: 'Suspended',
  renewal_submitted: 'Suspended, renewal submitted',
  revoked: 'Revoked',
  lapsed: 'Lapsed',
  ended: 'Ended',
  none: 'Not held',
};
export const STATE_COLORS: Record<AuthorisationState, string> = {
  active: 'success', suspended: 'error', renewal_submitted: 'warning', revoked: 'error', lapsed: 'grey', ended: 'grey', none: 'grey',
};

export const EVENT_KINDS = ['issued', 'renewed', 'suspended', 'reinstated', 'revoked', 'lapsed', 'renewal_submitted', 'restored', 'ended'] as const;
export type EventKind = (typeof EVENT_KINDS)[number];
export const EVENT_LABELS: Record<EventKind, string> = {
  issued: 'Issued', renewed: 'Renewed', suspended: 'Suspended', reinstated: 'Reinstated', revoked: 'Revoked', lapsed: 'Lapsed',
  renewal_submitted: 'Renewed certificate submitted', restored: 'In force again', ended: 'Ended',
};

export const PERIOD_ORIGINS = ['issued', 'renewed', 'prior', 'imported'] as const;
export type PeriodOrigin = (typeof PERIOD_ORIGINS)[number];
/** Shown wherever a period recorded from a paper record appears. */
export const PRIOR_LABEL = 'Recorded from before the portal';

export const SUSPEND_MEANING = 'Suspended this authorisation';
export const REINSTATE_MEANING = 'Reinstated this authorisation';
export const REVOKE_MEANING = 'Revoked this authorisation';
export const VERIFY_CERTIFICATE_MEANING = 'Checked this certificate against the original';
export const PRIOR_MEANING = 'Recorded from the paper record as attested';

/** The caution on the certificate and on the "What I may do" page. */
export const AUTHORISATION_CAUTION =
  'Mains voltage can kill. This authorisation covers only the work, voltage and current stated on it. Local regulations, the organisation\'s own rules and licensed practice take precedence.';
