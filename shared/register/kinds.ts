// Words and lists for the register, the matrix, findings and the incident pack, shared by server and client.
import type { AuthorisationState } from '../authorisations/kinds.js';

/** States a register row can have: every derived state but "not held" (such rows are not in the register). */
export const REGISTER_STATES = ['active', 'suspended', 'renewal_submitted', 'revoked', 'lapsed', 'ended'] as const satisfies readonly AuthorisationState[];
export type RegisterState = (typeof REGISTER_STATES)[number];

/**
 * Two readings of a past moment. "effective": everything that took effect by then, including what was
 * recorded later (a paper record entered afterwards, a lapse the sweep noted later). "known": only what
 * the portal had recorded by then, which is what anyone could have looked up at that moment.
 */
export const REGISTER_VIEWS = ['effective', 'known'] as const;
export type RegisterView = (typeof REGISTER_VIEWS)[number];
export const REGISTER_VIEW_LABELS: Record<RegisterView, string> = {
  effective: 'As it took effect (including what was recorded later)',
  known: 'As recorded by then',
};

export const REGISTER_SORTS = ['person', 'site', 'scope', 'expiry'] as const;
export type RegisterSort = (typeof REGISTER_SORTS)[number];

/** More rows than this go to CSV; a PDF of a whole organisation helps nobody. */
export const REGISTER_PDF_MAX_ROWS = 5000;

export const FINDING_SEVERITIES = ['observation', 'minor', 'major', 'critical'] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];
export const FINDING_SEVERITY_LABELS: Record<FindingSeverity, string> = {
  observation: 'Observation',
  minor: 'Minor non-conformity',
  major: 'Major non-conformity',
  critical: 'Critical: stop the work',
};

export const FINDING_STATUSES = ['open', 'answered', 'closed'] as const;
export type FindingStatus = (typeof FINDING_STATUSES)[number];
export const FINDING_STATUS_LABELS: Record<FindingStatus, string> = { open: 'Open', answered: 'Answered', closed: 'Closed' };

/** Records a finding can be raised against. */
export const FINDING_TARGETS = ['person', 'authorisation', 'procedure_version', 'practical', 'signoff', 'bench', 'bench_check', 'instrument', 'certificate', 'evidence', 'audit_entry'] as const;
export type FindingTarget = (typeof FINDING_TARGETS)[number];
export const FINDING_TARGET_LABELS: Record<FindingTarget, string> = {
  person: 'Person', authorisation: 'Authorisation', procedure_version: 'Procedure version', practical: 'Supervised practical', signoff: 'Sign-off',
  bench: 'Bench', bench_check: 'Pre-use check', instrument: 'Test instrument', certificate: 'External certificate', evidence: 'Evidence file',
  audit_entry: 'Audit trail entry',
};

/** The windows of the overview's "expiring soon" counts, in days. */
export const EXPIRY_WINDOWS = [30, 60, 90] as const;
/** The overview's chart: expiries per week over the next quarter. */
export const CHART_WEEKS = 13;
