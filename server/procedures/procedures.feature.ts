import type { Deps } from '../deps.js';
import type { RouteDef } from '../routing.js';
import type { Signatures } from '../signatures/signatures.service.js';
import { makeAcknowledgements } from './acknowledgements.service.js';
import { acknowledgementRoutes } from './acknowledgements.routes.js';
import { existingVersion } from './procedures.access.js';
import { makeProcedureDocuments } from './procedures.documents.js';
import { impactOf } from './procedures.impact.js';
import { makeLifecycle } from './procedures.lifecycle.js';
import { proceduresRoutes } from './procedures.routes.js';
import { makeProceduresService } from './procedures.service.js';
import { makeReviewReminders } from './review-reminders.service.js';

/** The procedures feature's services, wired once per app (features.ts registers this and the routes). */
export function makeProcedureServices(deps: Deps, signatures: Signatures) {
  const acknowledgements = makeAcknowledgements(deps, signatures);
  return {
    procedures: makeProceduresService(deps),
    lifecycle: makeLifecycle(deps, signatures, acknowledgements.notify),
    documents: makeProcedureDocuments(deps),
    acknowledgements,
    reminders: makeReviewReminders(deps),
    impact: async (id: string, versionId: string) => impactOf(deps.db, await existingVersion(deps.db, id, versionId), deps.clock.now()),
  };
}
export type ProcedureServices = ReturnType<typeof makeProcedureServices>;

export const procedureRoutes = (s: ProcedureServices): RouteDef[] => [...proceduresRoutes(s), ...acknowledgementRoutes(s)];
