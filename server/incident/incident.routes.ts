import { route, type RouteDef } from '../routing.js';
import { incidentBody } from '../../shared/schemas/register.js';
import type { makeIncidentService } from './incident.service.js';

export function incidentRoutes(s: ReturnType<typeof makeIncidentService>): RouteDef[] {
  return [
    route({
      method: 'post', path: '/incident-packs', access: ['read', 'Register'], body: incidentBody,
      handler: async ({ actor, ability, body, res }) => {
        const { zip, fileName } = await s.pack(actor!, ability, body);
        res.setHeader('Content-Type', 'application/zip');
        res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
        res.setHeader('Cache-Control', 'no-store');
        res.send(zip);
      },
    }),
  ];
}
