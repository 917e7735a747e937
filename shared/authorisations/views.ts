// Response shapes of the authorisations API, shared by the server (which builds them) and the client.
import type { AuthorisationState, CertificateKind, CertificateStatus, EventKind, PeriodOrigin, RequirementKind } from './kinds.js';

export interface RequirementView {
  id: string;
  kind: RequirementKind;
  label: string;
  procedureId: string | null;
  scopeId: string | null;
  certificateKind: CertificateKind | null;
  practicalsCount: number | null;
  practicalsWindowMonths: number | null;
}

export interface ScopeView {
  id: string;
  code: string;
  title: string;
  description: string;
  maxVoltageV: number;
  maxCurrentA: number;
  allowsLiveWork: boolean;
  validityMonths: number;
  reminderOffsetsDays: number[];
  certificateGraceDays: number;
  active: boolean;
  requirements: RequirementView[];
}

export interface SignatureView {
  id: string;
  signerId: string;
  printedName: string;
  meaning: string;
  signedAt: string;
}

export interface EventView {
  id: string;
  kind: EventKind;
  label: string;
  effectiveAt: string;
  recordedAt: string;
  actorName: string | null;
  reason: string | null;
  cause: string | null;
  signature: SignatureView | null;
}

export interface PeriodView {
  id: string;
  origin: PeriodOrigin;
  recordedFromBefore: boolean;
  startsAt: string;
  endsAt: string;
  validFrom: string;
  validUntil: string;
  issuedByName: string | null;
  attestedBy: string | null;
  priorNote: string | null;
  events: EventView[];
}

export interface HoldView {
  cause: string;
  since: string;
  reason: string | null;
  renewalSubmitted: boolean;
}

export interface AuthorisationSummary {
  id: string;
  holder: { id: string; name: string; siteId: string; siteName: string; timeZone: string };
  scope: { id: string; code: string; title: string; maxVoltageV: number; maxCurrentA: number; allowsLiveWork: boolean };
  state: AuthorisationState;
  stateLabel: string;
  since: string | null;
  reason: string | null;
  periodId: string | null;
  /** Local dates at the holder's site. */
  validFrom: string | null;
  validUntil: string | null;
  endsAt: string | null;
  daysLeft: number | null;
  recordedFromBefore: boolean;
}

export interface RenewHint {
  label: string;
  detail: string;
}

export interface MineItem extends AuthorisationSummary {
  renew: RenewHint[];
}

export interface EvidenceItemView {
  type: string;
  id: string;
  label: string;
  at: string;
}

export interface RequirementResultView {
  requirementId: string;
  kind: RequirementKind;
  label: string;
  met: boolean;
  detail: string;
  evidence: EvidenceItemView[];
  restsUntil: string | null;
}

export interface ScopeEligibilityView {
  scope: { id: string; code: string; title: string; allowsLiveWork: boolean };
  eligible: boolean;
  state: AuthorisationState;
  stateLabel: string;
  requirements: RequirementResultView[];
}

export interface EligibilityView {
  person: { id: string; name: string };
  evaluatedAt: string;
  scopes: ScopeEligibilityView[];
}

export interface AuthorisationDetail extends AuthorisationSummary {
  holds: HoldView[];
  periods: PeriodView[];
  snapshot: unknown;
}

export interface CertificateView {
  id: string;
  holderId: string;
  holderName: string;
  siteName: string;
  kind: CertificateKind;
  kindLabel: string;
  issuer: string;
  reference: string;
  issuedOn: string;
  expiresOn: string;
  expired: boolean;
  status: CertificateStatus;
  submittedAt: string;
  reviewedAt: string | null;
  reviewerName: string | null;
  rejectionReason: string | null;
  evidenceId: string | null;
  /** How the manager checked it: against the scan, or the original seen in person; null before this was asked. */
  checkedHow: 'scan' | 'original_seen' | null;
  originalSeen: { where: string; on: string } | null;
}

export interface MineView {
  person: { id: string; name: string };
  caution: string;
  items: MineItem[];
  certificates: CertificateView[];
}

export interface VerificationView {
  holderName: string;
  scopeTitle: string;
  validFrom: string;
  validUntil: string;
  state: 'current' | 'not current';
}

export interface DueView {
  items: AuthorisationSummary[];
  total: number;
  page: number;
  pageSize: number;
  certificates: CertificateView[];
}

export interface ImportRowReport {
  line: number;
  email: string;
  scope: string;
  problems: string[];
}

export interface ImportReport {
  dryRun: boolean;
  ok: boolean;
  rows: ImportRowReport[];
  written: { people: number; authorisations: number } | null;
  /** A large file is written by the job queue: follow it at GET /authorisations/import/jobs/:id. */
  job?: ImportJobView;
}

export type ImportJobStatus = 'queued' | 'running' | 'done' | 'failed';

export interface ImportJobView {
  id: string;
  status: ImportJobStatus;
  /** Rows in the file, and rows written so far (the rows become visible together when it is done). */
  total: number;
  done: number;
  written: { people: number; authorisations: number } | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}
