import type { Deps } from '../deps.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { makeScopesService } from './scopes.service.js';
import { makeAuthorisationsService } from './authorisations.service.js';
import { makeCertificatesService } from './certificates.service.js';
import { makeCertificateService } from './certificate.service.js';
import { makeActions } from './actions.service.js';
import { makePriorService } from './prior.service.js';
import { makeImportService } from './import.service.js';

export { reevaluatePerson, type EvaluationContext, type Change } from './issuing.js';
export { stateAt, statesAt, foldState, type DerivedState, type StateTarget } from './states.js';
export { endAuthorisationsOf } from './ending.js';

/** Every service of the authorisations feature, built once per app. */
export function makeAuthorisationsFeature(deps: Deps, signatures: Signatures) {
  return {
    scopes: makeScopesService(deps),
    authorisations: makeAuthorisationsService(deps),
    certificates: makeCertificatesService(deps, signatures),
    certificate: makeCertificateService(deps),
    actions: makeActions(deps, signatures),
    prior: makePriorService(deps, signatures),
    importer: makeImportService(deps, signatures),
  };
}
export type AuthorisationsFeature = ReturnType<typeof makeAuthorisationsFeature>;
