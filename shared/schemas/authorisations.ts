import { z } from 'zod';
import './messages.js';
import { line, name, paragraph } from './text.js';
import { isoDate, pageQuery, uuid } from './common.js';
import { CERTIFICATE_KINDS } from '../authorisations/kinds.js';

const password = z.string().min(1, 're-enter your password to sign').max(1024, 'password is too long');
const reason = paragraph().min(3, 'give a reason').max(500, 'use at most 500 characters');

export const requirementBody = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('procedure_ack'), procedureId: uuid('choose a procedure') }).strict(),
  z.object({ kind: z.literal('prerequisite'), scopeId: uuid('choose the scope it rests on') }).strict(),
  z.object({ kind: z.literal('certificate'), certificateKind: z.enum(CERTIFICATE_KINDS, { message: 'choose a kind of certificate' }) }).strict(),
  z.object({ kind: z.literal('checklist_signoff'), procedureId: uuid('choose a procedure') }).strict(),
  z.object({
    kind: z.literal('practicals'), procedureId: uuid('choose a procedure'),
    count: z.number().int('a whole number').min(1, 'at least 1').max(10, 'at most 10'),
    windowMonths: z.number().int('whole months').min(1, 'at least 1 month').max(60, 'at most 60 months'),
  }).strict(),
], { message: 'kind: use procedure_ack, checklist_signoff, practicals, prerequisite or certificate' });

export const scopeBody = z.object({
  code: z.string().trim().toUpperCase().regex(/^[A-Z0-9][A-Z0-9-]{1,23}$/, 'use 2–24 capital letters, digits or hyphens'),
  title: name().min(3, 'enter a title').max(160, 'use at most 160 characters'),
  description: paragraph().max(2000, 'use at most 2000 characters').default(''),
  maxVoltageV: z.number({ message: 'enter the voltage limit in volts' }).int('use whole volts').min(1, 'at least 1 V').max(1000, 'at most 1000 V'),
  maxCurrentA: z.number({ message: 'enter the current limit in amperes' }).gt(0, 'more than 0 A').max(100, 'at most 100 A'),
  allowsLiveWork: z.boolean(),
  validityMonths: z.number().int('use whole months').min(1, 'at least 1 month').max(60, 'at most 60 months'),
  reminderOffsetsDays: z.array(z.number().int().min(1, 'at least 1 day').max(365, 'at most 365 days')).max(6, 'at most 6 reminders')
    .refine((a) => new Set(a).size === a.length, 'each offset once').default([60, 30, 7]),
  certificateGraceDays: z.number().int().min(0, 'zero or more days').max(90, 'at most 90 days').default(0),
  active: z.boolean().default(true),
  requirements: z.array(requirementBody).max(20, 'at most 20 requirements').default([]),
}).strict();

export const certificateBody = z.object({
  holderId: uuid('choose the person').optional(),
  kind: z.enum(CERTIFICATE_KINDS, { message: 'choose a kind of certificate' }),
  issuer: name().min(2, 'name who issued it').max(160),
  reference: line().max(80).default(''),
  issuedOn: isoDate,
  expiresOn: isoDate,
  evidenceId: uuid('evidenceId must be an uploaded file id').optional(),
}).strict();

export const signBody = z.object({ password }).strict();
export const rejectBody = z.object({ reason }).strict();
export const actionBody = z.object({ reason, password }).strict();

export const priorBody = z.object({
  holderId: uuid('choose the person'),
  scopeId: uuid('choose the scope'),
  issuedOn: isoDate,
  expiresOn: isoDate,
  attestedBy: name().min(3, 'name who attested the paper record').max(200),
  evidenceId: uuid('evidenceId must be an uploaded file id').optional(),
  note: paragraph().max(1000).default(''),
  password,
}).strict();

export const importBody = z.object({
  csv: z.string().min(1, 'paste or choose a CSV file').max(200_000, 'the file is larger than 200 kB'),
  dryRun: z.boolean(),
  password: z.string().max(1024).optional(),
}).strict();

export const authorisationsQuery = pageQuery.extend({
  holderId: uuid().optional(),
  siteId: uuid().optional(),
  scopeId: uuid().optional(),
});

export const dueQuery = pageQuery.omit({ q: true }).extend({
  siteId: uuid('choose a site').optional(),
  withinDays: z.coerce.number().int().min(1).max(365).default(60),
});

export const certificatesQuery = pageQuery.omit({ q: true }).extend({
  holderId: uuid().optional(),
  siteId: uuid().optional(),
  status: z.enum(['submitted', 'verified', 'rejected']).optional(),
});

export const periodQuery = z.object({ periodId: uuid('periodId must be a UUID').optional() });
export const personScopeParams = z.object({ personId: uuid('personId must be a UUID'), scopeId: uuid('scopeId must be a UUID') });
export const personParam = z.object({ personId: uuid('personId must be a UUID') });
export const codeParam = z.object({ code: line().max(100) });

export type RequirementBody = z.infer<typeof requirementBody>;
export type ScopeBody = z.infer<typeof scopeBody>;
export type ScopeInput = z.input<typeof scopeBody>;
export type CertificateBody = z.infer<typeof certificateBody>;
export type PriorBody = z.infer<typeof priorBody>;
export type ImportBody = z.infer<typeof importBody>;
export type AuthorisationsQuery = z.infer<typeof authorisationsQuery>;
export type DueQuery = z.infer<typeof dueQuery>;
export type CertificatesQuery = z.infer<typeof certificatesQuery>;
