import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { ackTableQuery, extensionBody, personParams, signBody, versionParams } from '../../shared/schemas/procedures.js';
import type { ProcedureServices } from './procedures.feature.js';

export function acknowledgementRoutes({ acknowledgements }: ProcedureServices): RouteDef[] {
  return [
    route({
      method: 'post', path: '/procedures/:id/versions/:versionId/acknowledge', access: ['create', 'Acknowledgement'], params: versionParams, body: signBody, status: 201,
      handler: async ({ actor, ability, params, body }) => acknowledgements.acknowledge(actor!, ability, params.id, params.versionId, body.password),
    }),
    route({ method: 'get', path: '/procedures/:id/acknowledgements', access: ['read', 'Acknowledgement'], params: uuidParam, query: ackTableQuery, handler: async ({ ability, params, query }) => acknowledgements.table(ability, params.id, query) }),
    route({
      method: 'post', path: '/procedures/:id/acknowledgements/:userId/extension', access: ['update', 'Acknowledgement'], params: personParams, body: extensionBody,
      handler: async ({ actor, ability, params, body }) => acknowledgements.extend(actor!, ability, params.id, params.userId, body),
    }),
  ];
}
