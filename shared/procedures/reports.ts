// Response shapes for impact previews, acknowledgement tables and version comparisons.
import type { ChangeClass, AckState, VersionStatus } from '../schemas/procedures.js';

export interface ImpactPersonView {
  userId: string;
  name: string;
  email: string;
  siteName: string;
  lastAcknowledgedNumber: number;
  dueOn: string;
}

export interface ImpactView {
  changeClass: ChangeClass | null;
  /** What publishing asks: nothing (editorial or first issue), a re-read, or a re-read and re-assessment. */
  asks: 'nothing' | 're-read' | 're-assess';
  people: ImpactPersonView[];
  /** Authorisations running now whose scope requires something of this procedure. */
  authorisations: ImpactAuthorisationView[];
}

export interface ImpactAuthorisationView {
  authorisationId: string;
  holderId: string;
  holderName: string;
  scopeCode: string;
  scopeTitle: string;
  /** What the scope requires of this procedure: procedure_ack, checklist_signoff, practicals. */
  requires: string[];
  runsUntil: string;
  /** A re-assess version: the practicals done against earlier versions no longer count toward it. */
  practicalsNoLongerCount: boolean;
}

export interface AckRowView {
  userId: string;
  name: string;
  email: string;
  siteId: string;
  siteName: string;
  state: AckState;
  lastAcknowledgedNumber: number | null;
  lastAcknowledgedAt: string | null;
  dueOn: string | null;
  requestClass: 're-read' | 're-assess' | null;
  extensionReason: string | null;
}

export interface DiffSegment {
  text: string;
  mark?: 'added' | 'removed';
}
export interface DiffRow {
  kind: 'same' | 'changed' | 'added' | 'removed';
  left: DiffSegment[] | null;
  right: DiffSegment[] | null;
}
export interface DiffSection {
  title: string;
  changed: boolean;
  rows: DiffRow[];
}
export interface CompareView {
  from: { id: string; number: number; status: VersionStatus };
  to: { id: string; number: number; status: VersionStatus };
  sections: DiffSection[];
}
