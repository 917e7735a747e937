import { z } from 'zod';
import './messages.js';
import { isoMoment, pageQuery, uuid } from './common.js';
import { line, paragraph } from './text.js';
import { REGISTER_SORTS, REGISTER_STATES, REGISTER_VIEWS } from '../register/kinds.js';

/** A moment with its offset, e.g. 2026-03-05T14:30:00Z or 2026-03-05T15:30:00+01:00. */
export const moment = isoMoment;

const bool = z.enum(['true', 'false'], { message: 'use true or false' });

/** Which moment and how to read it: the register, the matrix and the evidence behind a row share these. */
export const momentQuery = z.object({
  at: moment.optional(),
  view: z.enum(REGISTER_VIEWS, { message: 'use effective or known' }).default('effective'),
});

export const registerFilter = momentQuery.extend({
  siteId: uuid('siteId must be a site id').optional(),
  scopeId: uuid('scopeId must be a scope id').optional(),
  personId: uuid('personId must be a person id').optional(),
  q: line().max(200).optional(),
  state: z.enum(REGISTER_STATES, { message: `use one of: ${REGISTER_STATES.join(', ')}` }).optional(),
  liveWork: bool.optional(),
  sort: z.enum(REGISTER_SORTS).default('person'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export const registerQuery = registerFilter.extend(pageQuery.omit({ q: true }).shape);
export type RegisterFilter = z.infer<typeof registerFilter>;
export type RegisterQuery = z.infer<typeof registerQuery>;

export const matrixQuery = momentQuery.extend(pageQuery.shape).extend({
  siteId: uuid('siteId must be a site id').optional(),
  liveWork: bool.optional(),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type MatrixQuery = z.infer<typeof matrixQuery>;

export const overviewQuery = z.object({ siteId: uuid('siteId must be a site id').optional() });
export type OverviewQuery = z.infer<typeof overviewQuery>;

export const personParam = z.object({ personId: uuid('personId must be a person id') });
export const authorisationParam = z.object({ authorisationId: uuid('authorisationId must be an authorisation id') });

export const incidentBody = z.object({
  personId: uuid('choose the person'),
  at: moment,
  benchId: uuid('benchId must be a bench id').optional(),
  note: paragraph().max(1000, 'use at most 1000 characters').default(''),
}).strict();
export type IncidentBody = z.infer<typeof incidentBody>;
