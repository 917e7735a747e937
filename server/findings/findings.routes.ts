import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { answerBody, closeBody, findingBody, findingsQuery } from '../../shared/schemas/findings.js';
import type { FindingsService } from './findings.service.js';

export function findingsRoutes(s: FindingsService): RouteDef[] {
  return [
    route({ method: 'get', path: '/findings', access: ['read', 'Finding'], query: findingsQuery, handler: async ({ query }) => s.list(query) }),
    route({
      method: 'get', path: '/findings/export.csv', access: ['read', 'Finding'], query: findingsQuery.omit({ page: true, pageSize: true }),
      handler: async ({ actor, query, res }) => {
        const text = await s.csv(actor!, query);
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', 'attachment; filename="findings.csv"');
        res.setHeader('Cache-Control', 'no-store');
        res.send(text);
      },
    }),
    route({ method: 'post', path: '/findings', access: ['create', 'Finding'], body: findingBody, status: 201, handler: async ({ actor, body }) => s.raise(actor!, body) }),
    route({ method: 'get', path: '/findings/:id', access: ['read', 'Finding'], params: uuidParam, handler: async ({ params }) => s.get(params.id) }),
    route({ method: 'post', path: '/findings/:id/answer', access: ['update', 'Finding'], params: uuidParam, body: answerBody, handler: async ({ actor, ability, params, body }) => s.answer(actor!, ability, params.id, body.response) }),
    route({ method: 'post', path: '/findings/:id/close', access: ['update', 'Finding'], params: uuidParam, body: closeBody, handler: async ({ actor, ability, params, body }) => s.close(actor!, ability, params.id, body.note) }),
  ];
}
