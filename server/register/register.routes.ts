import { route, type RouteDef } from '../routing.js';
import { authorisationParam, matrixQuery, momentQuery, overviewQuery, registerFilter, registerQuery } from '../../shared/schemas/register.js';
import type { RegisterFeature } from './index.js';

export function registerRoutes(f: RegisterFeature): RouteDef[] {
  return [
    route({ method: 'get', path: '/register', access: ['read', 'Register'], query: registerQuery, handler: async ({ ability, query }) => f.register.page(ability, query) }),
    route({
      method: 'get', path: '/register/export.csv', access: ['read', 'Register'], query: registerFilter,
      handler: async ({ actor, ability, query, res }) => {
        await f.exports.csv(actor!, await f.register.exportContext(actor!, ability, query), res);
      },
    }),
    route({
      method: 'get', path: '/register/export.pdf', access: ['read', 'Register'], query: registerFilter,
      handler: async ({ actor, ability, query, res }) => {
        const ctx = await f.register.exportContext(actor!, ability, query);
        const rows = await f.register.allRows(ctx);
        const findings = ability.can('read', 'Finding') ? await f.findings.all({ siteId: query.siteId }) : [];
        const { bytes, fileName } = await f.exports.pdf(actor!, ctx, rows, findings);
        res.setHeader('Content-Type', 'application/pdf');
        res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
        res.setHeader('Cache-Control', 'no-store');
        res.send(Buffer.from(bytes));
      },
    }),
    route({
      method: 'get', path: '/register/:authorisationId/evidence', access: ['read', 'Register'], params: authorisationParam, query: momentQuery,
      handler: async ({ ability, params, query }) => f.evidence.evidenceOf(ability, params.authorisationId, query),
    }),
    route({ method: 'get', path: '/matrix', access: ['read', 'Register'], query: matrixQuery, handler: async ({ ability, query }) => f.matrix.page(ability, query) }),
    route({ method: 'get', path: '/overview', access: ['read', 'Overview'], query: overviewQuery, handler: async ({ ability, query }) => f.overview.overview(ability, query) }),
  ];
}
