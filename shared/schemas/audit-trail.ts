import { z } from 'zod';
import './messages.js';
import { pageQuery, recordId, uuid } from './common.js';
import { moment } from './register.js';

export const auditTrailQuery = pageQuery.omit({ q: true }).extend({
  actorId: uuid('actorId must be a person id').optional(),
  entity: z.string().trim().regex(/^[a-z_]{2,40}$/, 'use a record kind such as authorisation_period').optional(),
  entityId: recordId().optional(),
  // Exact ("authorisation.revoked") or every action of a kind ("authorisation.").
  action: z.string().trim().regex(/^[a-z_]+(\.[a-z_]*)?$/, 'use an action such as authorisation.revoked, or authorisation. for all of them').optional(),
  from: moment.optional(),
  to: moment.optional(),
}).refine((q) => !q.from || !q.to || new Date(q.from) <= new Date(q.to), { message: 'must not be before from', path: ['to'] });
export type AuditTrailQuery = z.infer<typeof auditTrailQuery>;
