import type { Deps } from './deps.js';
import type { RouteDef } from './routing.js';
import { makeAuthService } from './auth/auth.service.js';
import { authRoutes } from './auth/auth.routes.js';
import { healthRoutes } from './health.routes.js';
import { makePeopleService } from './people/people.service.js';
import { peopleRoutes } from './people/people.routes.js';
import { makeSitesService } from './sites/sites.service.js';
import { sitesRoutes } from './sites/sites.routes.js';
import { mailRoutes } from './mail/mail.routes.js';
import { makeMailService } from './mail/mail.service.js';
import { makeSignatures } from './signatures/signatures.service.js';
import { makeProcedureServices, procedureRoutes } from './procedures/procedures.feature.js';
import { makeUsability } from './benches/usability.service.js';
import { makeBenchesService } from './benches/benches.service.js';
import { benchesRoutes } from './benches/benches.routes.js';
import { makeInstrumentsService } from './benches/instruments.service.js';
import { instrumentsRoutes } from './benches/instruments.routes.js';
import { makeEvidenceService } from './evidence/evidence.service.js';
import { evidenceRoutes } from './evidence/evidence.routes.js';
import { makeEngineService } from './engine/engine.service.js';
import { engineRoutes } from './engine/engine.routes.js';
import { makeSignoffsFeature, signoffRoutes } from './signoffs/signoffs.feature.js';
import { makePracticalsFeature, practicalRoutes } from './practicals/practicals.feature.js';
import { makeAuthorisationsFeature } from './authorisations/index.js';
import { authorisationRoutes } from './authorisations/authorisations.routes.js';
import { makeReminders } from './reminders/reminders.service.js';
import { reminderRoutes } from './reminders/reminders.routes.js';
import { makeJobs } from './jobs/index.js';
import { makeSealer } from './audit/sealer.js';
import { workSeal } from './jobs/seal.js';
import type { QueueWorker } from './jobs/index.js';
import { makeImportJobs } from './authorisations/import-jobs.service.js';
import { importJobRoutes } from './authorisations/import-jobs.routes.js';
import { makeRegisterFeature, registerFeatureRoutes } from './register/index.js';

/** Every feature's services, built once per app. */
export function buildServices(deps: Deps) {
  const auth = makeAuthService(deps);
  const people = makePeopleService(deps, auth);
  const sites = makeSitesService(deps);
  const mail = makeMailService(deps);
  const signatures = makeSignatures(deps, auth);
  const usability = makeUsability(deps);
  const equipment = { usability, benches: makeBenchesService(deps, signatures, usability), instruments: makeInstrumentsService(deps, usability) };
  const evidence = makeEvidenceService(deps);
  const procedures = makeProcedureServices(deps, signatures);
  const authorisations = makeAuthorisationsFeature(deps, signatures);
  const reminders = makeReminders(deps);
  // Procedure review-due reminders ride on the same scheduled sweep (30, 7 and 0 days before).
  // The audit trail is sealed after appends, and sealed and anchored outside the database with every sweep.
  const sealer = makeSealer(deps);
  // A sealing or anchoring failure is logged and tried again next sweep; it does not undo the sweep's reminders.
  const anchored = () => sealer.run({ anchor: true }).catch((err: Error) => deps.log.error({ err }, `audit: sealing with the sweep failed: ${err.message}`));
  const importJobs = makeImportJobs(deps, authorisations.importer, auth.loadActor);
  const workers: QueueWorker[] = [(b, work) => workSeal(b, deps, sealer, work), importJobs.work];
  const jobs = makeJobs(deps, reminders, [() => procedures.reminders.run(null, [30, 7, 0]), anchored], workers);
  const signoffs = makeSignoffsFeature(deps, signatures, usability);
  const practicals = makePracticalsFeature(deps, signatures, usability);
  const register = makeRegisterFeature(deps, { people, authorisations });
  return { auth, people, sites, mail, signatures, engine: makeEngineService(), ...equipment, evidence, procedures, authorisations, importJobs, reminders, jobs, signoffs, practicals, register };
}
export type Services = ReturnType<typeof buildServices>;

/** The one route table: the router is built from it and the permission-matrix test reads it. */
export function buildRouteTable(deps: Deps, s: Services): RouteDef[] {
  return [
    ...healthRoutes(deps),
    ...authRoutes(s.auth),
    ...peopleRoutes(s.people),
    ...sitesRoutes(s.sites),
    ...mailRoutes(s.mail),
    ...benchesRoutes(s.benches),
    ...instrumentsRoutes(s.instruments),
    ...evidenceRoutes(s.evidence, deps.config.uploadMaxBytes),
    ...engineRoutes(s.engine),
    ...procedureRoutes(s.procedures),
    ...signoffRoutes(s.signoffs),
    ...practicalRoutes(s.practicals),
    // Best effort, where sweeps run on their schedule: elsewhere the scheduled sweep does it within ten minutes.
    ...authorisationRoutes(s.authorisations, async () => {
      if (s.jobs.scheduled) await s.jobs.requestSweep(null).catch(() => undefined);
    }),
    ...importJobRoutes(s.importJobs),
    ...reminderRoutes(s.reminders, s.jobs),
    ...registerFeatureRoutes(s.register),
  ];
}
