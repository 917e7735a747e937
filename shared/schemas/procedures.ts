import { z } from 'zod';
import './messages.js';
import { line, name, paragraph } from './text.js';
import { isoDate, pageQuery, uuid } from './common.js';
import { checklistSchema } from './checklists.js';

export const PROCEDURE_CATEGORIES = ['dead-work', 'live-testing', 'live-fault-finding', 'commissioning', 'bench-equipment', 'general'] as const;
export type ProcedureCategory = (typeof PROCEDURE_CATEGORIES)[number];
export const CATEGORY_LABELS: Record<ProcedureCategory, string> = {
  'dead-work': 'Dead work and isolation',
  'live-testing': 'Live testing',
  'live-fault-finding': 'Live fault-finding',
  commissioning: 'Commissioning',
  'bench-equipment': 'Bench equipment',
  general: 'General',
};

export const VERSION_STATUSES = ['draft', 'in_review', 'published', 'superseded', 'withdrawn'] as const;
export type VersionStatus = (typeof VERSION_STATUSES)[number];
export const STATUS_LABELS: Record<VersionStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  published: 'Published',
  superseded: 'Superseded',
  withdrawn: 'Withdrawn',
};
/** Versions that are no longer the one to work to. */
export const NOT_IN_FORCE: readonly VersionStatus[] = ['superseded', 'withdrawn'];

export const CHANGE_CLASSES = ['editorial', 're-read', 're-assess'] as const;
export type ChangeClass = (typeof CHANGE_CLASSES)[number];
export const CHANGE_CLASS_LABELS: Record<ChangeClass, string> = {
  editorial: 'Editorial: nothing is asked of anyone',
  're-read': 'Re-read: everyone who acknowledged before acknowledges again by a deadline',
  're-assess': 'Re-assess: as re-read, and practicals done against earlier versions no longer count',
};

export const APPROVAL_MEANING = 'approved for use';
export const ACKNOWLEDGEMENT_MEANING = 'I will work to this version';

const code = z.string().trim().toUpperCase().min(3, 'use 3 to 24 characters').max(24, 'use 3 to 24 characters')
  .regex(/^[A-Z0-9][A-Z0-9-]*$/, 'use capital letters, digits and hyphens');
const title = name().min(3, 'give a title (at least 3 characters)').max(200, 'use at most 200 characters');
const category = z.enum(PROCEDURE_CATEGORIES, { message: 'choose a category' });
const reviewPeriodMonths = z.coerce.number({ message: 'enter a number of months' }).int('use whole months').min(1, 'at least 1 month').max(60, 'at most 60 months');
const listLine = line().min(2, 'write at least 2 characters').max(300, 'use at most 300 characters');
const list = (max: number) => z.array(listLine).max(max, `at most ${max} entries`);

export const stepSchema = z.object({
  key: uuid('key must be a UUID').optional(),
  text: paragraph().min(3, 'write the step (at least 3 characters)').max(2000, 'use at most 2000 characters'),
  caution: paragraph().max(1000, 'use at most 1000 characters').nullish().transform((v) => v || null),
  holdPoint: z.boolean().default(false),
});
export type StepInput = z.input<typeof stepSchema>;
export type Step = z.infer<typeof stepSchema>;

export const createProcedureBody = z.object({ code, title, category, reviewPeriodMonths });
export type CreateProcedureBody = z.infer<typeof createProcedureBody>;

/** Saving a draft: the whole content, as the editor holds it. Completeness is checked at submission. */
export const saveDraftBody = z.object({
  title,
  category,
  reviewPeriodMonths,
  scope: paragraph().max(4000, 'use at most 4000 characters').default(''),
  hazards: list(30).default([]),
  ppe: list(30).default([]),
  equipment: list(40).default([]),
  steps: z.array(stepSchema).max(80, 'at most 80 steps').default([]),
  checklists: z.array(checklistSchema).max(10, 'at most 10 checklists').default([]),
  changeSummary: paragraph().max(2000, 'use at most 2000 characters').nullish().transform((v) => v || null),
  changeClass: z.enum(CHANGE_CLASSES, { message: 'choose a change class' }).nullish().transform((v) => v ?? null),
  rereadDays: z.coerce.number().int('use whole days').min(1, 'at least 1 day').max(180, 'at most 180 days').default(14),
});
export type SaveDraftBody = z.infer<typeof saveDraftBody>;
export type SaveDraftInput = z.input<typeof saveDraftBody>;

export const versionParams = z.object({ id: uuid('id must be a UUID'), versionId: uuid('versionId must be a UUID') });
export const personParams = z.object({ id: uuid('id must be a UUID'), userId: uuid('userId must be a UUID') });

export const signBody = z.object({ password: z.string().min(1, 're-enter your password to sign').max(1024) });
export const returnBody = z.object({ comment: paragraph().min(3, 'say what needs changing').max(4000) });
export const withdrawBody = z.object({ reason: paragraph().min(3, 'give a reason').max(1000) });
export const extensionBody = z.object({ dueOn: isoDate, reason: paragraph().min(3, 'give a reason').max(1000) });
export const compareQuery = z.object({ from: uuid('choose the older version'), to: uuid('choose the newer version') });
export const reminderRunBody = z.object({
  offsets: z.array(z.number().int().min(0).max(365)).min(1).max(10).default([30, 7, 0]),
});

const bool = z.enum(['true', 'false']).transform((v) => v === 'true');
export const procedureListQuery = pageQuery.extend({
  status: z.enum(VERSION_STATUSES).optional(),
  category: category.optional(),
  overdue: bool.optional(),
  sort: z.enum(['code', 'title', 'updatedAt', 'reviewDueOn']).default('code'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export type ProcedureListQuery = z.infer<typeof procedureListQuery>;

export const ACK_STATES = ['acknowledged', 're-read-due', 'overdue', 'older-version', 'not-acknowledged', 'not-in-force'] as const;
export type AckState = (typeof ACK_STATES)[number];
export const ACK_STATE_LABELS: Record<AckState, string> = {
  acknowledged: 'Acknowledged',
  're-read-due': 'Re-read due',
  overdue: 'Re-read overdue',
  'older-version': 'Acknowledged an older version only',
  'not-acknowledged': 'Not acknowledged',
  'not-in-force': 'No version in force',
};
export const ackTableQuery = pageQuery.extend({
  siteId: uuid().optional(),
  state: z.enum(ACK_STATES).optional(),
});
export type AckTableQuery = z.infer<typeof ackTableQuery>;
