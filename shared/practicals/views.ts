// Response shapes of the sign-offs and practicals API, shared by the server's presenters and the client.
import type { LimitSource } from '../engine/limits.js';
import type { AcceptanceRule, ItemKind } from '../schemas/checklists.js';
import type { Circuit, Outcome, PracticalStatus } from '../schemas/practicals.js';
import type { SignoffKind, SignoffStatus } from '../schemas/signoffs.js';
import type { SignatureView } from '../procedures/views.js';
import type { Expectations } from './expectations.js';

export interface EntryView {
  checked: boolean | null;
  text: string | null;
  evidenceId: string | null;
  value: number | null;
  didNotTrip: boolean;
  unit: string | null;
  instrument: { id: string; label: string } | null;
  verdict: 'pass' | 'fail' | null;
  judgedBy: 'rule' | 'assessor' | null;
  expected: number | null;
  tolerance: string | null;
  ruleText: string | null;
  source: LimitSource | null;
  note: string | null;
  recordedAt: string;
  recordedByName: string;
  /** Practicals: its place in the order things were done at the bench (1, 2, …, across entries and hold points). */
  seq: number | null;
}

/** One reading of a measurement item of a practical; a re-recorded one stays, with the reason it was taken again. */
export interface AttemptView {
  seq: number;
  value: number | null;
  didNotTrip: boolean;
  unit: string;
  instrument: string;
  recordedAt: string;
  recordedByName: string;
  verdict: 'pass' | 'fail' | null;
  expected: number | null;
  tolerance: string | null;
  reason: string | null;
}

export interface RecordItemView {
  id: string;
  position: number;
  kind: ItemKind;
  prompt: string;
  guidance: string | null;
  unit: string | null;
  rule: AcceptanceRule | null;
  /** The procedure step the item belongs to (null: no particular step). */
  stepKey: string | null;
  ruleText: string | null;
  /** For a computed rule: the engine's figure and band before anything is measured. */
  expected: number | null;
  tolerance: string | null;
  noExpectation: boolean;
  entry: EntryView | null;
  /** Practicals: every reading of a measurement item, in order (the last is the entry). */
  attempts?: AttemptView[];
  /** What is still missing or failing, in words; null when the item is complete. */
  problem: string | null;
}

export interface RecordLink {
  id: string;
  reason: string | null;
  at: string;
}

interface RecordBase {
  id: string;
  siteId: string;
  procedure: { id: string; code: string; versionId: string; number: number; title: string; inForce: boolean };
  checklist: { id: string; title: string; kind: string };
  items: RecordItemView[];
  progress: { done: number; total: number };
  signatures: SignatureView[];
  /** The record this one corrects, and the one that corrects it. */
  corrects: RecordLink | null;
  correctedBy: RecordLink | null;
  createdAt: string;
  updatedAt: string;
}

export interface SignoffView extends RecordBase {
  kind: SignoffKind;
  status: SignoffStatus;
  person: { id: string; name: string };
  bench: { id: string; code: string; name: string } | null;
  passed: boolean | null;
  notes: string | null;
  submittedAt: string | null;
  review: { byName: string; at: string; comment: string | null; outcome: 'countersigned' | 'returned' } | null;
  benchCheckId: string | null;
}

export interface HoldPointView {
  stepKey: string;
  position: number;
  /** 1-based among the hold points, in procedure order. */
  number: number;
  text: string;
  caution: string | null;
  witnessed: { at: string; byName: string; note: string | null; seq: number | null } | null;
}

/** One step of the procedure version, as the bench screen lists it. */
export interface PracticalStepView {
  key: string;
  /** 1-based, in procedure order. */
  number: number;
  text: string;
  caution: string | null;
  holdPoint: boolean;
  /** The step to work on now: the first with an unwitnessed hold point or an item still to record. */
  current: boolean;
}

export interface PracticalView extends RecordBase {
  status: PracticalStatus;
  technician: { id: string; name: string; email: string };
  assessor: { id: string; name: string };
  bench: { id: string; code: string; name: string; supplyVoltage: number; supplyFrequency: number };
  scope: { id: string; code: string; title: string } | null;
  circuit: Circuit;
  expectations: Expectations;
  holdPoints: HoldPointView[];
  /** Every step of the procedure version in order, with its caution and hold point. */
  steps: PracticalStepView[];
  /** Instruments named when the practical was opened, and any used since. */
  instruments: { id: string; label: string }[];
  outcome: Outcome | null;
  outcomeComment: string | null;
  /** Why the technician worked on a bench of another site; null at their own site. */
  crossSiteReason: string | null;
  /** The manager's decision that let a Type AC bench be used; null otherwise. */
  typeAcDecision: { byName: string; at: string; reason: string } | null;
  heldAt: string;
  assessedAt: string | null;
  acknowledgedAt: string | null;
}

export interface SignoffRowView {
  id: string;
  kind: SignoffKind;
  status: SignoffStatus;
  personName: string;
  procedureCode: string;
  versionNumber: number;
  checklistTitle: string;
  benchCode: string | null;
  done: number;
  total: number;
  submittedAt: string | null;
  updatedAt: string;
  correctsId: string | null;
  correctedById: string | null;
}

export interface PracticalRowView {
  id: string;
  status: PracticalStatus;
  outcome: Outcome | null;
  technicianName: string;
  assessorName: string;
  benchCode: string;
  procedureCode: string;
  versionNumber: number;
  failed: number;
  /** Readings that failed, counting those taken again since (every attempt stays in the record). */
  failedAttempts: number;
  heldAt: string;
  correctsId: string | null;
  correctedById: string | null;
}
