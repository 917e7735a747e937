// Response shapes of the register, matrix, overview, audit trail, findings and person record.
import type { RegisterState, RegisterView, FindingSeverity, FindingStatus, FindingTarget } from './kinds.js';
import type { AuthorisationState } from '../authorisations/kinds.js';

export interface RegisterRow {
  authorisationId: string;
  periodId: string;
  person: { id: string; name: string };
  site: { id: string; code: string; name: string; timeZone: string };
  scope: { id: string; code: string; title: string; allowsLiveWork: boolean; maxVoltageV: number; maxCurrentA: number };
  state: RegisterState;
  stateLabel: string;
  since: string;
  /** Local dates at the person's site. */
  validFrom: string;
  validUntil: string;
  endsAt: string;
  recordedFromBefore: boolean;
}

/** What moment a page stands for, and how it was read. */
export interface MomentInfo {
  at: string;
  view: RegisterView;
  /** True when no moment was asked for: the register as it stands now. */
  isNow: boolean;
}

export interface RegisterPage extends MomentInfo {
  items: RegisterRow[];
  total: number;
  page: number;
  pageSize: number;
}

export interface MatrixCell {
  authorisationId: string;
  state: RegisterState;
  stateLabel: string;
  validUntil: string;
}

export interface MatrixPage extends MomentInfo {
  scopes: { id: string; code: string; title: string; allowsLiveWork: boolean }[];
  people: { id: string; name: string; siteCode: string; active: boolean; cells: Record<string, MatrixCell> }[];
  total: number;
  page: number;
  pageSize: number;
}

export interface EvidenceRecordView {
  type: string;
  id: string;
  label: string;
  at: string;
  /** Files kept with that record, read-only. */
  files: { id: string; fileName: string; mediaType: string; sizeBytes: number; sha256: string }[];
}

export interface RowEvidenceView extends MomentInfo {
  row: RegisterRow;
  events: { kind: string; label: string; effectiveAt: string; recordedAt: string; reason: string | null; actorName: string | null; signedBy: string | null }[];
  basis: { kind: string; label: string; met: boolean; detail: string; evidence: EvidenceRecordView[] }[];
  paperRecord: { attestedBy: string; issuedOn: string; expiresOn: string; note: string; fileId: string | null } | null;
  evaluatedAt: string;
}

export interface AuditEntryView {
  id: number;
  at: string;
  actorId: string | null;
  actorName: string | null;
  action: string;
  entity: string;
  entityId: string;
  oldValues: unknown;
  newValues: unknown;
}

/** What can be wrong with the sealed chain; entries not sealed yet are counted apart and are no fault. */
export type ChainIssueKind = 'truncated_tail' | 'gap' | 'fork' | 'edited' | 'unsealed_inside' | 'anchor_mismatch' | 'anchor_forged';

export interface ChainIssueView {
  kind: ChainIssueKind;
  /** 1-based position in the sealed chain, where the issue is there; null for an anchor's own finding. */
  position: number | null;
  entryId: number | null;
  /** The anchor file line, for issues found against an anchor. */
  anchorLine: number | null;
  detail: string;
  /** The entry named, when it is still in the trail. */
  entry: AuditEntryView | null;
}

export interface ChainReportView {
  intact: boolean;
  checkedAt: string;
  /** Every entry in the trail: sealed, and written but not yet sealed. */
  entries: number;
  sealed: number;
  unsealed: number;
  head: { id: number; position: number; hmac: string } | null;
  /** The newest line of the anchor file (kept outside the database), if any. */
  lastAnchor: { at: string; id: number; hmac: string; line: number } | null;
  anchors: number;
  /** Up to 50 issues, in the order found; `issueCount` counts them all. */
  issues: ChainIssueView[];
  issueCount: number;
}

export interface FindingView {
  id: string;
  entity: FindingTarget;
  entityId: string;
  recordLabel: string;
  siteId: string | null;
  siteName: string | null;
  severity: FindingSeverity;
  severityLabel: string;
  status: FindingStatus;
  statusLabel: string;
  text: string;
  raisedBy: string;
  raisedAt: string;
  response: string | null;
  answeredBy: string | null;
  answeredAt: string | null;
  closingNote: string | null;
  closedBy: string | null;
  closedAt: string | null;
}

export interface OverviewView {
  at: string;
  counts: { siteId: string; siteCode: string; scopeId: string; scopeCode: string; state: AuthorisationState; n: number }[];
  expiring: { days: number; n: number }[];
  soonest: RegisterRow[];
  overdueAcknowledgements: { n: number; items: { personId: string; personName: string; siteCode: string; procedureCode: string; versionNumber: number; dueOn: string }[] };
  weeks: { from: string; n: number }[];
}

export interface PersonRecordView {
  person: {
    id: string; name: string; email: string; roles: string[]; active: boolean; accessEndsOn: string | null; deactivatedReason: string | null;
    site: { id: string; code: string; name: string; timeZone: string }; coveredSiteIds: string[];
  };
  authorisations: (import('../authorisations/views.js').AuthorisationSummary & { periods: import('../authorisations/views.js').PeriodView[] })[];
  certificates: import('../authorisations/views.js').CertificateView[];
  acknowledgements: { procedureCode: string; versionNumber: number; acknowledgedAt: string; printedName: string }[];
  signoffs: import('../practicals/views.js').SignoffRowView[];
  /** Each practical with every reading taken in it, in order (failed ones and those taken again included). */
  practicals: (import('../practicals/views.js').PracticalRowView & { readings: (import('../practicals/views.js').AttemptView & { prompt: string })[] })[];
}
