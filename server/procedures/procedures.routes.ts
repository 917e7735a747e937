import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import {
  compareQuery, createProcedureBody, procedureListQuery, reminderRunBody, returnBody, saveDraftBody, signBody, versionParams, withdrawBody,
} from '../../shared/schemas/procedures.js';
import type { ProcedureServices } from './procedures.feature.js';

export function proceduresRoutes(s: ProcedureServices): RouteDef[] {
  const { procedures, lifecycle, documents, impact, reminders } = s;
  return [
    route({ method: 'get', path: '/procedures', access: ['read', 'Procedure'], query: procedureListQuery, handler: async ({ actor, ability, query }) => procedures.list(actor!, ability, query) }),
    route({ method: 'post', path: '/procedures', access: ['create', 'Procedure'], body: createProcedureBody, status: 201, handler: async ({ actor, body }) => procedures.create(actor!, body) }),
    route({ method: 'post', path: '/procedures/review-reminders/run', access: ['create', 'ReviewReminder'], body: reminderRunBody, handler: async ({ actor, body }) => reminders.run(actor, body.offsets) }),
    route({ method: 'get', path: '/procedures/:id', access: ['read', 'Procedure'], params: uuidParam, handler: async ({ ability, params }) => procedures.get(ability, params.id) }),
    route({ method: 'get', path: '/procedures/:id/compare', access: ['read', 'Procedure'], params: uuidParam, query: compareQuery, handler: async ({ ability, params, query }) => documents.compare(ability, params.id, query.from, query.to) }),
    route({ method: 'post', path: '/procedures/:id/versions', access: ['create', 'Procedure'], params: uuidParam, status: 201, handler: async ({ actor, params }) => procedures.newDraft(actor!, params.id) }),
    route({ method: 'get', path: '/procedures/:id/versions/:versionId', access: ['read', 'Procedure'], params: versionParams, handler: async ({ actor, ability, params }) => procedures.getVersion(actor!, ability, params.id, params.versionId) }),
    route({ method: 'put', path: '/procedures/:id/versions/:versionId', access: ['update', 'Procedure'], params: versionParams, body: saveDraftBody, handler: async ({ actor, params, body }) => procedures.saveDraft(actor!, params.id, params.versionId, body) }),
    route({ method: 'post', path: '/procedures/:id/versions/:versionId/submit', access: ['update', 'Procedure'], params: versionParams, handler: async ({ actor, params }) => lifecycle.submit(actor!, params.id, params.versionId) }),
    route({ method: 'post', path: '/procedures/:id/versions/:versionId/return', access: ['approve', 'Procedure'], params: versionParams, body: returnBody, handler: async ({ actor, ability, params, body }) => lifecycle.returnToDraft(actor!, ability, params.id, params.versionId, body.comment) }),
    route({ method: 'post', path: '/procedures/:id/versions/:versionId/approve', access: ['approve', 'Procedure'], params: versionParams, body: signBody, handler: async ({ actor, ability, params, body }) => lifecycle.approve(actor!, ability, params.id, params.versionId, body.password) }),
    route({ method: 'post', path: '/procedures/:id/versions/:versionId/withdraw', access: ['update', 'Procedure'], params: versionParams, body: withdrawBody, handler: async ({ actor, params, body }) => lifecycle.withdraw(actor!, params.id, params.versionId, body.reason) }),
    route({ method: 'get', path: '/procedures/:id/versions/:versionId/impact', access: ['approve', 'Procedure'], params: versionParams, handler: async ({ params }) => impact(params.id, params.versionId) }),
    route({
      method: 'get', path: '/procedures/:id/versions/:versionId/pdf', access: ['read', 'Procedure'], params: versionParams,
      handler: async ({ actor, ability, params, res }) => {
        const { bytes, fileName } = await documents.pdf(actor!, ability, params.id, params.versionId);
        res.status(200).type('application/pdf').set('Content-Disposition', `inline; filename="${fileName}"`).set('X-Content-Type-Options', 'nosniff').send(Buffer.from(bytes));
        return undefined;
      },
    }),
  ];
}
