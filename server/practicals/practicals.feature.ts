import type { Deps } from '../deps.js';
import type { RouteDef } from '../routing.js';
import type { Signatures } from '../signatures/signatures.service.js';
import type { Usability } from '../benches/usability.service.js';
import { makePracticalsService } from './practicals.service.js';
import { makePracticalRecording } from './practicals.record.js';
import { makePracticalSigning } from './practicals.signing.js';
import { makePracticalCorrections } from './practicals.corrections.js';
import { practicalsRoutes } from './practicals.routes.js';

/** The practicals feature's services, wired once per app (features.ts registers this and the routes). */
export function makePracticalsFeature(deps: Deps, signatures: Signatures, usability: Usability) {
  return {
    practicals: makePracticalsService(deps, signatures, usability),
    recording: makePracticalRecording(deps, signatures, usability),
    signing: makePracticalSigning(deps, signatures),
    corrections: makePracticalCorrections(deps, signatures),
  };
}
export type PracticalsFeature = ReturnType<typeof makePracticalsFeature>;

export const practicalRoutes = (s: PracticalsFeature): RouteDef[] => practicalsRoutes(s);
