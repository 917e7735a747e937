import { z } from 'zod';
import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { evidenceQuery, evidenceUploadFields } from '../../shared/schemas/evidence.js';
import type { makeEvidenceService } from './evidence.service.js';
import { parseUpload, sendEvidence } from './evidence.http.js';

const contentQuery = z.object({ preview: z.enum(['0', '1']).optional() });

export function evidenceRoutes(evidence: ReturnType<typeof makeEvidenceService>, uploadMaxBytes: number): RouteDef[] {
  return [
    route({ method: 'get', path: '/evidence', access: ['read', 'Evidence'], query: evidenceQuery, handler: async ({ ability, query }) => evidence.list(ability, query) }),
    route({
      // Multipart: the form is parsed only after the access check, by the before hook.
      method: 'post', path: '/evidence', access: ['create', 'Evidence'], before: parseUpload(uploadMaxBytes), body: evidenceUploadFields, status: 201,
      handler: async ({ req, actor, ability, body }) => evidence.upload(actor!, ability, body, req.file),
    }),
    route({ method: 'get', path: '/evidence/:id', access: ['read', 'Evidence'], params: uuidParam, handler: async ({ ability, params }) => evidence.get(ability, params.id) }),
    route({
      method: 'get', path: '/evidence/:id/content', access: ['read', 'Evidence'], params: uuidParam, query: contentQuery,
      handler: async ({ res, ability, params, query }) => {
        const { meta, bytes } = await evidence.content(ability, params.id);
        sendEvidence(res, meta, bytes, query.preview === '1');
        return undefined;
      },
    }),
  ];
}
