import { route, type RouteDef } from '../routing.js';
import { auditTrailQuery } from '../../shared/schemas/audit-trail.js';
import type { TrailService } from './trail.service.js';

export function trailRoutes(s: TrailService): RouteDef[] {
  return [
    route({ method: 'get', path: '/audit', access: ['read', 'AuditLog'], query: auditTrailQuery, handler: async ({ query }) => s.page(query) }),
    // A POST because it is an action someone takes; it changes nothing.
    route({ method: 'post', path: '/audit/verify', access: ['read', 'AuditLog'], handler: async () => s.verify() }),
  ];
}
