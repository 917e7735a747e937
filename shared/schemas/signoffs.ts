import { z } from 'zod';
import './messages.js';
import { line, paragraph } from './text.js';
import { pageQuery, uuid } from './common.js';
import { SIGNOFF_KINDS, SIGNOFF_STATUSES } from '../practicals/terms.js';

export { SIGNOFF_KINDS, SIGNOFF_STATUSES, SIGNOFF_KIND_LABELS, SIGNOFF_STATUS_LABELS, COMPLETED_MEANING, COUNTERSIGNED_MEANING, type SignoffKind, type SignoffStatus } from '../practicals/terms.js';

/**
 * One checklist entry as it is made; which fields count depends on the item's kind (tick: checked,
 * text: text, evidence: evidenceId, measurement: value, unit, instrument). The server names a missing one.
 */
export const entryBody = z.object({
  checked: z.boolean({ message: 'tick or untick' }).optional(),
  text: paragraph().max(4000, 'use at most 4000 characters').optional(),
  evidenceId: uuid('choose an uploaded file').optional(),
  value: z.union([z.number({ message: 'enter a number' }).min(-1e9).max(1e9), z.literal('did-not-trip')], { error: 'enter a number, or "did-not-trip" for a trip test' }).optional(),
  unit: line().min(1, 'give the unit').max(20).optional(),
  instrumentId: uuid('choose the instrument used').optional(),
  /** Only where no expectation could be computed: the assessor's own judgement. */
  assessorVerdict: z.enum(['pass', 'fail'], { message: 'say whether the reading is acceptable' }).optional(),
  note: paragraph().max(1000, 'use at most 1000 characters').optional(),
  /** Practicals: why a reading is taken again (every attempt stays in the record). */
  reason: line().min(3, 'say why the reading is taken again (at least 3 characters)').max(300, 'use at most 300 characters').optional(),
}).strict();
export type EntryBody = z.infer<typeof entryBody>;

export const openSignoffBody = z.object({
  procedureId: uuid('choose the procedure'),
  versionId: uuid('choose the procedure version'),
  checklistId: uuid('choose the checklist'),
  benchId: uuid('choose the bench').optional(),
});
export type OpenSignoffBody = z.infer<typeof openSignoffBody>;

export const submitSignoffBody = z.object({
  password: z.string().min(1, 're-enter your password to sign').max(1024),
  /** A bench pre-use check whose readings fail is still recorded, as a failed check, when the person says so. */
  recordAsFailed: z.boolean().default(false),
});
export const countersignBody = z.object({ password: z.string().min(1, 're-enter your password to sign').max(1024) });
export const returnSignoffBody = z.object({ comment: paragraph().min(3, 'say what needs correcting').max(4000) });

export const signoffListQuery = pageQuery.extend({
  view: z.enum(['mine', 'site']).default('mine'),
  status: z.enum(SIGNOFF_STATUSES).optional(),
  kind: z.enum(SIGNOFF_KINDS).optional(),
  siteId: uuid().optional(),
  /** Only what the reader could countersign: submitted self sign-offs of other people. */
  awaitingMe: z.enum(['true', 'false']).transform((v) => v === 'true').optional(),
  sort: z.enum(['updatedAt', 'submittedAt', 'status']).default('updatedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});
export type SignoffListQuery = z.infer<typeof signoffListQuery>;

export const itemParams = z.object({ id: uuid('id must be a UUID'), itemId: uuid('itemId must be a UUID') });
