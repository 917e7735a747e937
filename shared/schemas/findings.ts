import { z } from 'zod';
import './messages.js';
import { paragraph } from './text.js';
import { pageQuery, recordId, uuid } from './common.js';
import { FINDING_SEVERITIES, FINDING_STATUSES, FINDING_TARGETS } from '../register/kinds.js';

const text = (what: string, max: number) => paragraph().min(3, `write the ${what}`).max(max, `use at most ${max} characters`);

export const findingBody = z.object({
  entity: z.enum(FINDING_TARGETS, { message: `use one of: ${FINDING_TARGETS.join(', ')}` }),
  entityId: recordId('give the record id'),
  severity: z.enum(FINDING_SEVERITIES, { message: `use one of: ${FINDING_SEVERITIES.join(', ')}` }),
  text: text('finding', 4000),
}).strict();
export type FindingBody = z.infer<typeof findingBody>;

export const answerBody = z.object({ response: text('answer', 4000) }).strict();
export const closeBody = z.object({ note: text('closing note', 2000) }).strict();

export const findingsQuery = pageQuery.extend({
  status: z.enum(FINDING_STATUSES).optional(),
  severity: z.enum(FINDING_SEVERITIES).optional(),
  siteId: uuid('siteId must be a site id').optional(),
  entity: z.enum(FINDING_TARGETS).optional(),
  entityId: recordId().optional(),
});
export type FindingsQuery = z.infer<typeof findingsQuery>;
