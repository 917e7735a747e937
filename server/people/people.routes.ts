import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { inviteBody, peopleQuery, updatePersonBody } from '../../shared/schemas/people.js';
import type { makePeopleService } from './people.service.js';

export function peopleRoutes(people: ReturnType<typeof makePeopleService>): RouteDef[] {
  return [
    route({ method: 'get', path: '/people', access: ['read', 'User'], query: peopleQuery, handler: async ({ ability, query }) => people.list(ability, query) }),
    route({ method: 'post', path: '/people', access: ['invite', 'User'], body: inviteBody, status: 201, handler: async ({ actor, ability, body }) => people.invite(actor!, ability, body) }),
    route({ method: 'get', path: '/people/:id', access: ['read', 'User'], params: uuidParam, handler: async ({ ability, params }) => people.get(ability, params.id) }),
    route({
      method: 'patch', path: '/people/:id', access: ['update', 'User'], params: uuidParam, body: updatePersonBody,
      handler: async ({ actor, ability, params, body }) => people.update(actor!, ability, params.id, body),
    }),
    route({
      method: 'post', path: '/people/:id/invitation', access: ['invite', 'User'], params: uuidParam, status: 202,
      handler: async ({ actor, ability, params }) => {
        await people.resendInvite(actor!, ability, params.id);
        return { message: 'A new link was sent.' };
      },
    }),
    route({
      method: 'delete', path: '/people/:id/sessions', access: ['delete', 'Session'], params: uuidParam,
      handler: async ({ actor, params, req }) => people.endSessions(actor!, params.id, req.sessionID),
    }),
  ];
}
