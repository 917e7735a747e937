import { route, type RouteDef } from '../routing.js';
import {
  earthContinuityInputSchema, inductiveInputSchema, inverseInputSchema, limitCheckInputSchema, ratingsInputSchema,
  resistiveInputSchema, thermalInputSchema, triggerInputSchema,
} from '../../shared/schemas/engine.js';
import type { EngineService } from './engine.service.js';

// Every signed-in role may compute; nothing is stored, so there is nothing more to check.
export function engineRoutes(engine: EngineService): RouteDef[] {
  const access = 'signed-in' as const;
  return [
    route({ method: 'post', path: '/engine/resistive', access, body: resistiveInputSchema, handler: async ({ body }) => engine.resistive(body) }),
    route({ method: 'post', path: '/engine/inverse', access, body: inverseInputSchema, handler: async ({ body }) => engine.inverse(body) }),
    route({ method: 'post', path: '/engine/inductive', access, body: inductiveInputSchema, handler: async ({ body }) => engine.inductive(body) }),
    route({ method: 'post', path: '/engine/trigger', access, body: triggerInputSchema, handler: async ({ body }) => engine.trigger(body) }),
    route({ method: 'post', path: '/engine/thermal', access, body: thermalInputSchema, handler: async ({ body }) => engine.thermal(body) }),
    route({ method: 'post', path: '/engine/ratings', access, body: ratingsInputSchema, handler: async ({ body }) => engine.ratings(body) }),
    route({ method: 'post', path: '/engine/limit-check', access, body: limitCheckInputSchema, handler: async ({ body }) => engine.limitCheck(body) }),
    route({
      method: 'post', path: '/engine/earth-continuity', access, body: earthContinuityInputSchema,
      handler: async ({ body }) => engine.earthContinuity(body),
    }),
    route({ method: 'get', path: '/engine/limit-presets', access, handler: async () => engine.limitPresets() }),
  ];
}
