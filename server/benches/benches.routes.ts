import { z } from 'zod';
import { route, type RouteDef } from '../routing.js';
import { pageQuery, uuidParam } from '../../shared/schemas/common.js';
import { benchBody, benchesQuery, benchUpdateBody, preUseCheckBody } from '../../shared/schemas/benches.js';
import { typeAcDecisionBody } from '../../shared/schemas/bench-decisions.js';
import type { makeBenchesService } from './benches.service.js';

const checksQuery = pageQuery.omit({ q: true });

export function benchesRoutes(benches: ReturnType<typeof makeBenchesService>): RouteDef[] {
  return [
    route({ method: 'get', path: '/benches', access: ['read', 'Bench'], query: benchesQuery, handler: async ({ ability, query }) => benches.list(ability, query) }),
    route({ method: 'post', path: '/benches', access: ['create', 'Bench'], body: benchBody, status: 201, handler: async ({ actor, ability, body }) => benches.create(actor!, ability, body) }),
    route({ method: 'get', path: '/benches/:id', access: ['read', 'Bench'], params: uuidParam, handler: async ({ ability, params }) => benches.get(ability, params.id) }),
    route({
      method: 'patch', path: '/benches/:id', access: ['update', 'Bench'], params: uuidParam, body: benchUpdateBody,
      handler: async ({ actor, ability, params, body }) => benches.update(actor!, ability, params.id, body),
    }),
    route({
      method: 'get', path: '/benches/:id/usability', access: ['read', 'Bench'], params: uuidParam, query: z.object({}).strict(),
      handler: async ({ ability, params }) => benches.usabilityOf(ability, params.id),
    }),
    route({
      method: 'get', path: '/benches/:id/type-ac-decisions', access: ['read', 'Bench'], params: uuidParam, query: z.object({}).strict(),
      handler: async ({ ability, params }) => benches.typeAc.list(ability, params.id),
    }),
    route({
      method: 'post', path: '/benches/:id/type-ac-decisions', access: ['update', 'Bench'], params: uuidParam, body: typeAcDecisionBody, status: 201,
      handler: async ({ actor, ability, params, body }) => benches.typeAc.record(actor!, ability, params.id, body),
    }),
    route({
      method: 'get', path: '/benches/:id/pre-use-checks', access: ['read', 'BenchCheck'], params: uuidParam, query: checksQuery,
      handler: async ({ ability, params, query }) => benches.listChecks(ability, params.id, query.page, query.pageSize),
    }),
    route({
      method: 'post', path: '/benches/:id/pre-use-checks', access: ['create', 'BenchCheck'], params: uuidParam, body: preUseCheckBody, status: 201,
      handler: async ({ actor, ability, params, body }) => benches.recordCheck(actor!, ability, params.id, body),
    }),
  ];
}
