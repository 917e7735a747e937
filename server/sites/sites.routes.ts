import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { siteBody, siteUpdateBody } from '../../shared/schemas/sites.js';
import type { makeSitesService } from './sites.service.js';

export function sitesRoutes(sites: ReturnType<typeof makeSitesService>): RouteDef[] {
  return [
    route({ method: 'get', path: '/sites', access: ['read', 'Site'], handler: async () => sites.list() }),
    route({ method: 'post', path: '/sites', access: ['create', 'Site'], body: siteBody, status: 201, handler: async ({ actor, body }) => sites.create(actor!, body) }),
    route({
      method: 'patch', path: '/sites/:id', access: ['update', 'Site'], params: uuidParam, body: siteUpdateBody,
      handler: async ({ actor, params, body }) => sites.update(actor!, params.id, body),
    }),
  ];
}
