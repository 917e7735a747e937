import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { instrumentBody, instrumentsQuery, instrumentUpdateBody, usabilityQuery } from '../../shared/schemas/instruments.js';
import type { makeInstrumentsService } from './instruments.service.js';

export function instrumentsRoutes(instruments: ReturnType<typeof makeInstrumentsService>): RouteDef[] {
  return [
    route({ method: 'get', path: '/instruments', access: ['read', 'Instrument'], query: instrumentsQuery, handler: async ({ ability, query }) => instruments.list(ability, query) }),
    route({
      method: 'post', path: '/instruments', access: ['create', 'Instrument'], body: instrumentBody, status: 201,
      handler: async ({ actor, ability, body }) => instruments.create(actor!, ability, body),
    }),
    route({ method: 'get', path: '/instruments/:id', access: ['read', 'Instrument'], params: uuidParam, handler: async ({ ability, params }) => instruments.get(ability, params.id) }),
    route({
      method: 'patch', path: '/instruments/:id', access: ['update', 'Instrument'], params: uuidParam, body: instrumentUpdateBody,
      handler: async ({ actor, ability, params, body }) => instruments.update(actor!, ability, params.id, body),
    }),
    route({
      method: 'get', path: '/instruments/:id/usability', access: ['read', 'Instrument'], params: uuidParam, query: usabilityQuery,
      handler: async ({ ability, params, query }) => instruments.usabilityOf(ability, params.id, query.voltage),
    }),
  ];
}
