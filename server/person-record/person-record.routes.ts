import { route, type RouteDef } from '../routing.js';
import { personParam } from '../../shared/schemas/register.js';
import type { makePersonRecordService } from './person-record.service.js';

export function personRecordRoutes(s: ReturnType<typeof makePersonRecordService>): RouteDef[] {
  return [
    // Everyone signed in may ask; the service answers only for one's own record or people one may oversee.
    route({ method: 'get', path: '/people/:personId/record', access: ['read', 'PersonRecord'], params: personParam, handler: async ({ ability, params }) => s.record(ability, params.personId) }),
  ];
}
