import type { Deps } from '../deps.js';
import type { RouteDef } from '../routing.js';
import type { makePeopleService } from '../people/people.service.js';
import type { AuthorisationsFeature } from '../authorisations/index.js';
import { makeRegisterService } from './register.service.js';
import { makeRegisterExports } from './register.export.js';
import { makeRowEvidence } from './register.evidence.js';
import { makeMatrixService } from './matrix.service.js';
import { makeOverviewService } from './overview.service.js';
import { registerRoutes } from './register.routes.js';
import { makeFindingsService } from '../findings/findings.service.js';
import { findingsRoutes } from '../findings/findings.routes.js';
import { makeTrailService } from '../audit/trail.service.js';
import { trailRoutes } from '../audit/trail.routes.js';
import { makeIncidentService } from '../incident/incident.service.js';
import { incidentRoutes } from '../incident/incident.routes.js';
import { makePersonRecordService } from '../person-record/person-record.service.js';
import { personRecordRoutes } from '../person-record/person-record.routes.js';

/** What auditors come for: the register now and then, its exports, the audit trail, findings, packs and records. */
export function makeRegisterFeature(deps: Deps, s: { people: ReturnType<typeof makePeopleService>; authorisations: AuthorisationsFeature }) {
  return {
    register: makeRegisterService(deps),
    exports: makeRegisterExports(deps),
    evidence: makeRowEvidence(deps),
    matrix: makeMatrixService(deps),
    overview: makeOverviewService(deps),
    findings: makeFindingsService(deps),
    trail: makeTrailService(deps),
    incident: makeIncidentService(deps),
    personRecord: makePersonRecordService(deps, s),
  };
}
export type RegisterFeature = ReturnType<typeof makeRegisterFeature>;

export const registerFeatureRoutes = (f: RegisterFeature): RouteDef[] => [
  ...registerRoutes(f), ...findingsRoutes(f.findings), ...trailRoutes(f.trail), ...incidentRoutes(f.incident), ...personRecordRoutes(f.personRecord),
];
