import { route, type RouteDef } from '../routing.js';
import { certificateCheckBody } from '../../shared/schemas/certificate-check.js';
import { uuidParam } from '../../shared/schemas/common.js';
import {
  actionBody, authorisationsQuery, certificateBody, certificatesQuery, codeParam, dueQuery, importBody, periodQuery, personParam, personScopeParams,
  priorBody, rejectBody, scopeBody, signBody,
} from '../../shared/schemas/authorisations.js';
import type { AuthorisationsFeature } from './index.js';
import type { ManagerAction } from './actions.service.js';

/** `scopeSaved` runs after a scope was created or edited (the app asks the queue for a sweep, which re-decides everyone it concerns). */
export function authorisationRoutes(f: AuthorisationsFeature, scopeSaved: () => Promise<void> = async () => undefined): RouteDef[] {
  const saved = async <T>(result: T) => {
    await scopeSaved();
    return result;
  };
  const action = (name: ManagerAction) => route({
    method: 'post', path: `/authorisations/:id/${name}`, access: ['update', 'Authorisation'], params: uuidParam, body: actionBody,
    handler: async ({ actor, ability, params, body }) => f.actions.act(actor!, ability, params.id, name, body),
  });
  return [
    route({ method: 'get', path: '/scopes', access: ['read', 'Scope'], handler: async () => f.scopes.list() }),
    route({ method: 'get', path: '/scopes/:id', access: ['read', 'Scope'], params: uuidParam, handler: async ({ params }) => f.scopes.get(params.id) }),
    route({ method: 'post', path: '/scopes', access: ['create', 'Scope'], body: scopeBody, status: 201, handler: async ({ actor, body }) => saved(await f.scopes.create(actor!, body)) }),
    route({ method: 'put', path: '/scopes/:id', access: ['update', 'Scope'], params: uuidParam, body: scopeBody, handler: async ({ actor, params, body }) => saved(await f.scopes.update(actor!, params.id, body)) }),

    route({ method: 'get', path: '/authorisations/mine', access: ['read', 'Authorisation'], handler: async ({ actor }) => f.authorisations.mine(actor!) }),
    route({ method: 'get', path: '/authorisations/due', access: ['read', 'Authorisation'], query: dueQuery, handler: async ({ ability, query }) => f.authorisations.due(ability, query) }),
    route({ method: 'post', path: '/authorisations/prior', access: ['create', 'Authorisation'], body: priorBody, status: 201, handler: async ({ actor, ability, body }) => f.prior.record(actor!, ability, body) }),
    route({ method: 'post', path: '/authorisations/import', access: ['create', 'Authorisation'], body: importBody, handler: async ({ actor, ability, body }) => f.importer.run(actor!, ability, body) }),
    route({ method: 'get', path: '/authorisations', access: ['read', 'Authorisation'], query: authorisationsQuery, handler: async ({ ability, query }) => f.authorisations.list(ability, query) }),
    route({ method: 'get', path: '/authorisations/:id', access: ['read', 'Authorisation'], params: uuidParam, handler: async ({ ability, params }) => f.authorisations.detail(ability, params.id) }),
    route({
      method: 'get', path: '/authorisations/:id/certificate', access: ['read', 'Authorisation'], params: uuidParam, query: periodQuery,
      handler: async ({ ability, params, query, res }) => {
        const { bytes, fileName } = await f.certificate.pdf(ability, params.id, query.periodId);
        res.setHeader('Content-Type', 'application/pdf');
        res.setHeader('Content-Disposition', `inline; filename="${fileName}"`);
        res.setHeader('Cache-Control', 'no-store');
        res.send(Buffer.from(bytes));
      },
    }),
    action('suspend'),
    action('reinstate'),
    action('revoke'),

    route({ method: 'get', path: '/eligibility/:personId', access: ['read', 'Authorisation'], params: personParam, handler: async ({ ability, params }) => f.authorisations.eligibility(ability, params.personId) }),
    route({
      method: 'get', path: '/eligibility/:personId/:scopeId', access: ['read', 'Authorisation'], params: personScopeParams,
      handler: async ({ ability, params }) => f.authorisations.eligibility(ability, params.personId, params.scopeId),
    }),

    route({ method: 'get', path: '/certificates', access: ['read', 'Certificate'], query: certificatesQuery, handler: async ({ ability, query }) => f.certificates.list(ability, query) }),
    route({ method: 'post', path: '/certificates', access: ['create', 'Certificate'], body: certificateBody, status: 201, handler: async ({ actor, ability, body }) => f.certificates.submit(actor!, ability, body) }),
    route({
      method: 'post', path: '/certificates/:id/verify', access: ['update', 'Certificate'], params: uuidParam, body: certificateCheckBody,
      handler: async ({ actor, ability, params, body }) => f.certificates.verify(actor!, ability, params.id, body),
    }),
    route({
      method: 'post', path: '/certificates/:id/reject', access: ['update', 'Certificate'], params: uuidParam, body: rejectBody,
      handler: async ({ actor, ability, params, body }) => f.certificates.reject(actor!, ability, params.id, body.reason),
    }),

    route({ method: 'get', path: '/verify/:code', access: 'public', params: codeParam, handler: async ({ params }) => f.certificate.verify(params.code) }),
  ];
}
