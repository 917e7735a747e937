import type { AcceptedRequirementKind, RequirementKind } from '../../shared/authorisations/kinds.js';
import type { CertificateRow } from './certificates.repository.js';
import type { AckFact, PersonRow } from './facts.repository.js';
import type { RecordFact } from './records-facts.repository.js';
import type { RequirementRow, ScopeWithRequirements } from './scopes.repository.js';
import type { DerivedState } from './states.js';
import { evaluateCertificate } from './requirement-certificate.js';
import { evaluatePrerequisite } from './requirement-prerequisite.js';
import { evaluateProcedureAck } from './requirement-procedure.js';
import { evaluatePracticals } from './requirement-practicals.js';
import { evaluateSignoff } from './requirement-signoff.js';

export interface EvidenceItem {
  type: 'certificate' | 'authorisation' | 'acknowledgement' | 'practical' | 'signoff';
  id: string;
  label: string;
  at: Date;
}

/** One requirement judged for one person at one moment. */
export interface RequirementResult {
  requirementId: string;
  kind: RequirementKind;
  label: string;
  met: boolean;
  /** Met: what it rests on. Unmet: what is missing, in words the person can act on. */
  detail: string;
  evidence: EvidenceItem[];
  /** When the evidence that meets it was recorded (fresh evidence renews). */
  metSince: Date | null;
  /** The moment this basis runs out: a period resting on it ends no later (null: it does not run out). */
  restsUntil: Date | null;
}

/** What the evaluators read: loaded once per person, states filled in prerequisite order. */
export interface EvaluationFacts {
  person: PersonRow;
  now: Date;
  certificates: CertificateRow[];
  acks: Map<string, AckFact>;
  practicals: RecordFact[];
  signoffs: RecordFact[];
  /** Per procedure, the version in force and from which numbers sign-offs and practicals count. */
  thresholds: Map<string, { number: number; ackFrom: number; assessFrom: number }>;
  scopes: Map<string, ScopeWithRequirements>;
  /** The person's state per scope id, as decided so far in this evaluation. */
  states: Map<string, DerivedState>;
}

export type Evaluator = (req: RequirementRow, facts: EvaluationFacts) => RequirementResult;

/** One evaluator per kind a scope may list. */
export const EVALUATORS: Record<AcceptedRequirementKind, Evaluator> = {
  certificate: evaluateCertificate,
  prerequisite: evaluatePrerequisite,
  procedure_ack: evaluateProcedureAck,
  practicals: evaluatePracticals,
  checklist_signoff: evaluateSignoff,
};

export function evaluateRequirement(req: RequirementRow, facts: EvaluationFacts): RequirementResult {
  const evaluator = EVALUATORS[req.kind as AcceptedRequirementKind];
  if (evaluator) return evaluator(req, facts);
  // A kind stored before its evaluator existed cannot be met: say so rather than guess.
  return { requirementId: req.id, kind: req.kind as RequirementKind, label: req.kind, met: false, detail: 'The portal does not record this kind of evidence yet.', evidence: [], metSince: null, restsUntil: null };
}

export function evaluateScope(scope: ScopeWithRequirements, facts: EvaluationFacts): RequirementResult[] {
  return scope.requirements.map((r) => evaluateRequirement(r, facts));
}
