// Response shapes of the procedures API, shared by the server's presenters and the client.
import type { AcceptanceRule, ChecklistKind, ItemKind } from '../schemas/checklists.js';
import type { AckState, ChangeClass, ProcedureCategory, VersionStatus } from '../schemas/procedures.js';
import type { ChangeCheck } from './change-class.js';

export interface SignatureView {
  id: string;
  signerId: string;
  printedName: string;
  meaning: string;
  signedAt: string;
}

export interface ProcedureRowView {
  id: string;
  code: string;
  title: string;
  category: ProcedureCategory;
  /** Of the newest version the reader may see. */
  status: VersionStatus;
  versionId: string;
  versionNumber: number;
  /** The version in force, if any. */
  publishedVersionId: string | null;
  publishedNumber: number | null;
  ownerName: string;
  updatedAt: string;
  reviewDueOn: string | null;
  reviewOverdue: boolean;
  /** The reader's own standing on the version in force. */
  myState: AckState | null;
  myDueOn: string | null;
}

export interface VersionSummaryView {
  id: string;
  number: number;
  status: VersionStatus;
  title: string;
  changeClass: ChangeClass | null;
  changeSummary: string | null;
  authorName: string;
  approverName: string | null;
  createdAt: string;
  submittedAt: string | null;
  publishedAt: string | null;
  supersededAt: string | null;
  withdrawnAt: string | null;
}

export interface ProcedureView {
  id: string;
  code: string;
  site: { id: string; code: string; name: string; timeZone: string };
  ownerName: string;
  createdAt: string;
  updatedAt: string;
  inForce: { versionId: string; number: number; reviewDueOn: string | null; reviewOverdue: boolean } | null;
  open: { versionId: string; number: number; status: VersionStatus } | null;
  versions: VersionSummaryView[];
}

export interface StepView {
  key: string;
  text: string;
  caution: string | null;
  holdPoint: boolean;
}

export interface ChecklistItemView {
  id: string | null;
  key: string;
  kind: ItemKind;
  prompt: string;
  guidance: string | null;
  unit: string | null;
  rule: AcceptanceRule | null;
  /** The step of the same version the item belongs to (null: no particular step). */
  stepKey: string | null;
  /** The acceptance rule in words, with its source where it has one. */
  ruleText: string | null;
}

export interface ChecklistView {
  id: string | null;
  key: string;
  kind: ChecklistKind;
  title: string;
  items: ChecklistItemView[];
}

export interface VersionView {
  id: string;
  procedureId: string;
  code: string;
  number: number;
  status: VersionStatus;
  inForce: boolean;
  title: string;
  category: ProcedureCategory;
  reviewPeriodMonths: number;
  scope: string;
  hazards: string[];
  ppe: string[];
  equipment: string[];
  steps: StepView[];
  checklists: ChecklistView[];
  changeClass: ChangeClass | null;
  changeSummary: string | null;
  rereadDays: number;
  author: { id: string; name: string };
  editors: { id: string; name: string }[];
  basedOn: { id: string; number: number } | null;
  /** For a later version: the least change class its steps allow, with the reasons. */
  changeCheck: ChangeCheck | null;
  createdAt: string;
  updatedAt: string;
  submittedAt: string | null;
  returned: { byName: string; at: string; comment: string } | null;
  approval: SignatureView | null;
  publishedAt: string | null;
  reviewDueOn: string | null;
  reviewOverdue: boolean;
  supersededAt: string | null;
  withdrawn: { at: string; byName: string; reason: string } | null;
  siteTimeZone: string;
  /** The reader's own acknowledgement of this version. */
  myAcknowledgement: SignatureView | null;
}
