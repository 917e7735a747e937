import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { countersignBody, entryBody, itemParams, openSignoffBody, returnSignoffBody, signoffListQuery, submitSignoffBody } from '../../shared/schemas/signoffs.js';
import { correctionBody } from '../../shared/schemas/practicals.js';
import type { SignoffsFeature } from './signoffs.feature.js';

export function signoffsRoutes(s: SignoffsFeature): RouteDef[] {
  const { signoffs, signing, corrections } = s;
  return [
    route({ method: 'get', path: '/signoffs', access: ['read', 'Signoff'], query: signoffListQuery, handler: async ({ actor, ability, query }) => signoffs.list(actor!, ability, query) }),
    route({ method: 'post', path: '/signoffs', access: ['create', 'Signoff'], body: openSignoffBody, status: 201, handler: async ({ actor, ability, body }) => signoffs.open(actor!, ability, body) }),
    route({ method: 'get', path: '/signoffs/:id', access: ['read', 'Signoff'], params: uuidParam, handler: async ({ ability, params }) => signoffs.get(ability, params.id) }),
    route({ method: 'put', path: '/signoffs/:id/items/:itemId', access: ['update', 'Signoff'], params: itemParams, body: entryBody, handler: async ({ actor, ability, params, body }) => signoffs.saveEntry(actor!, ability, params.id, params.itemId, body) }),
    route({ method: 'post', path: '/signoffs/:id/submit', access: ['update', 'Signoff'], params: uuidParam, body: submitSignoffBody, handler: async ({ actor, ability, params, body }) => signing.submit(actor!, ability, params.id, body) }),
    route({ method: 'post', path: '/signoffs/:id/countersign', access: ['approve', 'Signoff'], params: uuidParam, body: countersignBody, handler: async ({ actor, ability, params, body }) => signing.countersign(actor!, ability, params.id, body.password) }),
    route({ method: 'post', path: '/signoffs/:id/return', access: ['approve', 'Signoff'], params: uuidParam, body: returnSignoffBody, handler: async ({ actor, ability, params, body }) => signing.returnIt(actor!, ability, params.id, body.comment) }),
    route({ method: 'post', path: '/signoffs/:id/corrections', access: ['create', 'Signoff'], params: uuidParam, body: correctionBody, status: 201, handler: async ({ actor, ability, params, body }) => corrections.open(actor!, ability, params.id, body.reason) }),
  ];
}
