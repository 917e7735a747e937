import type { Deps } from '../deps.js';
import type { RouteDef } from '../routing.js';
import type { Signatures } from '../signatures/signatures.service.js';
import type { Usability } from '../benches/usability.service.js';
import { makeSignoffsService } from './signoffs.service.js';
import { makeSignoffSigning } from './signoffs.signing.js';
import { makeSignoffCorrections } from './signoffs.corrections.js';
import { signoffsRoutes } from './signoffs.routes.js';

/** The sign-offs feature's services, wired once per app (features.ts registers this and the routes). */
export function makeSignoffsFeature(deps: Deps, signatures: Signatures, usability: Usability) {
  return {
    signoffs: makeSignoffsService(deps, signatures, usability),
    signing: makeSignoffSigning(deps, signatures),
    corrections: makeSignoffCorrections(deps, signatures),
  };
}
export type SignoffsFeature = ReturnType<typeof makeSignoffsFeature>;

export const signoffRoutes = (s: SignoffsFeature): RouteDef[] => signoffsRoutes(s);
