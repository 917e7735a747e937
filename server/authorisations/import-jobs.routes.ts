import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import type { ImportJobs } from './import-jobs.service.js';

/** A large import's progress, for the person who started it (anyone else: 404). */
export function importJobRoutes(jobs: ImportJobs): RouteDef[] {
  return [
    route({ method: 'get', path: '/authorisations/import/jobs/:id', access: ['create', 'Authorisation'], params: uuidParam, handler: async ({ actor, params }) => jobs.status(actor!, params.id) }),
  ];
}
