import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { entryBody, itemParams } from '../../shared/schemas/signoffs.js';
import {
  acknowledgeBody, candidatesQuery, correctionBody, holdPointParams, openPracticalBody, outcomeBody, practicalListQuery, witnessBody,
} from '../../shared/schemas/practicals.js';
import type { PracticalsFeature } from './practicals.feature.js';

export function practicalsRoutes(s: PracticalsFeature): RouteDef[] {
  const { practicals, recording, signing, corrections } = s;
  return [
    route({ method: 'get', path: '/practicals', access: ['read', 'Practical'], query: practicalListQuery, handler: async ({ actor, ability, query }) => practicals.list(actor!, ability, query) }),
    route({ method: 'post', path: '/practicals', access: ['create', 'Practical'], body: openPracticalBody, status: 201, handler: async ({ actor, ability, body }) => practicals.open(actor!, ability, body) }),
    route({ method: 'get', path: '/practicals/technicians', access: ['create', 'Practical'], query: candidatesQuery, handler: async ({ actor, query }) => practicals.candidates(actor!, query.q) }),
    route({ method: 'get', path: '/practicals/:id', access: ['read', 'Practical'], params: uuidParam, handler: async ({ ability, params }) => practicals.get(ability, params.id) }),
    route({ method: 'put', path: '/practicals/:id/items/:itemId', access: ['update', 'Practical'], params: itemParams, body: entryBody, handler: async ({ actor, ability, params, body }) => recording.saveEntry(actor!, ability, params.id, params.itemId, body) }),
    route({ method: 'post', path: '/practicals/:id/hold-points/:stepKey', access: ['update', 'Practical'], params: holdPointParams, body: witnessBody, handler: async ({ actor, ability, params, body }) => recording.witness(actor!, ability, params.id, params.stepKey, body.note) }),
    route({ method: 'post', path: '/practicals/:id/assess', access: ['update', 'Practical'], params: uuidParam, body: outcomeBody, handler: async ({ actor, ability, params, body }) => signing.assess(actor!, ability, params.id, body) }),
    // Signed in as the assessor (on their device) or as the technician; the technician's own password signs.
    route({ method: 'post', path: '/practicals/:id/acknowledge', access: ['read', 'Practical'], params: uuidParam, body: acknowledgeBody, handler: async ({ actor, ability, params, body }) => signing.acknowledge(actor!, ability, params.id, body) }),
    route({ method: 'post', path: '/practicals/:id/corrections', access: ['create', 'Practical'], params: uuidParam, body: correctionBody, status: 201, handler: async ({ actor, ability, params, body }) => corrections.open(actor!, ability, params.id, body.reason) }),
  ];
}
