import type { RequirementResult } from './requirements.js';
import type { ScopeRow } from './scopes.repository.js';

/** What an authorisation was issued on, frozen with it: shown on its certificate and kept for audits. */
export function evidenceSnapshot(scope: ScopeRow, results: RequirementResult[], at: Date, completedBy: string | null, restsOn: RequirementResult | null) {
  return {
    evaluatedAt: at.toISOString(),
    completedBy,
    scope: { code: scope.code, title: scope.title, maxVoltageV: scope.maxVoltageV, maxCurrentA: scope.maxCurrentA, allowsLiveWork: scope.allowsLiveWork, validityMonths: scope.validityMonths },
    expirySetBy: restsOn ? restsOn.label : `the scope's validity of ${scope.validityMonths} months`,
    requirements: results.map((r) => ({
      kind: r.kind, label: r.label, met: r.met, detail: r.detail,
      evidence: r.evidence.map((e) => ({ type: e.type, id: e.id, label: e.label, at: e.at.toISOString() })),
    })),
  };
}

export interface SnapshotRequirement {
  kind: string;
  label: string;
  met: boolean;
  detail: string;
  evidence: { type: string; id: string; label: string; at: string }[];
}

export interface EvidenceSnapshot {
  evaluatedAt: string;
  completedBy: string | null;
  expirySetBy?: string;
  requirements: SnapshotRequirement[];
  paperRecord?: { attestedBy: string; issuedOn: string; expiresOn: string; note: string };
}
