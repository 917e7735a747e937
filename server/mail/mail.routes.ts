import { route, type RouteDef } from '../routing.js';
import { uuidParam } from '../../shared/schemas/common.js';
import { mailListQuery } from '../../shared/schemas/mail.js';
import type { MailService } from './mail.service.js';

/** The outbox page (admins): every message, its delivery state, and a retry for a failed one. */
export function mailRoutes(mail: MailService): RouteDef[] {
  return [
    route({ method: 'get', path: '/mail', access: ['read', 'MailLog'], query: mailListQuery, handler: async ({ query }) => mail.list(query) }),
    route({ method: 'get', path: '/mail/:id', access: ['read', 'MailLog'], params: uuidParam, handler: async ({ params }) => mail.get(params.id) }),
    // Only admins read the outbox, so only they may send a message again (shared/abilities.ts has no write action for it yet).
    route({ method: 'post', path: '/mail/:id/retry', access: ['read', 'MailLog'], params: uuidParam, handler: async ({ actor, params }) => mail.retry(actor!.id, params.id) }),
  ];
}
