import { z } from 'zod';
import './messages.js';
import { line, name, paragraph } from './text.js';
import { uuid } from './common.js';
import { LIMIT_PRESETS } from '../engine/limits.js';
import { COMPUTED_QUANTITIES, COMPUTED_QUANTITY_IDS } from '../procedures/quantities.js';

export const CHECKLIST_KINDS = ['self-sign-off', 'practical-assessment', 'bench-pre-use'] as const;
export type ChecklistKind = (typeof CHECKLIST_KINDS)[number];
export const CHECKLIST_KIND_LABELS: Record<ChecklistKind, string> = {
  'self-sign-off': 'Self sign-off (the technician completes it)',
  'practical-assessment': 'Practical assessment (an assessor completes it)',
  'bench-pre-use': 'Bench pre-use check',
};

export const ITEM_KINDS = ['tick', 'text', 'evidence', 'measurement'] as const;
export type ItemKind = (typeof ITEM_KINDS)[number];
export const ITEM_KIND_LABELS: Record<ItemKind, string> = {
  tick: 'Tick box',
  text: 'Written answer',
  evidence: 'Evidence upload (required)',
  measurement: 'Measurement',
};

const presetIds = LIMIT_PRESETS.map((p) => p.id) as [string, ...string[]];
const finite = z.number({ message: 'enter a number' });

export const toleranceSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('absolute'), value: finite.positive('the tolerance must be above zero').max(1e6) }),
  z.object({ mode: z.literal('relative'), percent: finite.positive('the tolerance must be above zero').max(100, 'at most 100 %') }),
]);

/** How a measured value is judged. Stored as JSON beside the item; the practicals feature applies it. */
export const acceptanceRuleSchema = z.discriminatedUnion('type', [
  z
    .object({ type: z.literal('range'), min: finite.optional(), max: finite.optional() })
    .refine((r) => r.min !== undefined || r.max !== undefined, { path: ['min'], message: 'give a lower limit, an upper limit or both' })
    .refine((r) => r.min === undefined || r.max === undefined || r.min <= r.max, { path: ['max'], message: 'the upper limit must not be below the lower one' }),
  z.object({ type: z.literal('preset'), presetId: z.enum(presetIds, { message: 'choose a limit from the list' }) }),
  z.object({
    type: z.literal('earth-continuity'),
    lengthM: finite.positive('enter the lead length').max(100),
    csaMm2: finite.positive('enter the conductor cross-section').max(50),
  }),
  z.object({
    type: z.literal('computed'),
    quantity: z.enum(COMPUTED_QUANTITY_IDS, { message: 'choose what the engine computes' }),
    tolerance: toleranceSchema,
  }),
]);
export type AcceptanceRule = z.infer<typeof acceptanceRuleSchema>;

const key = uuid('key must be a UUID').optional();
/** The step of the same version the item belongs to; nothing of a later step is recorded before an earlier hold point is witnessed. */
const stepKey = uuid('choose a step of this procedure').nullish().transform((v) => v ?? null);
const prompt = line().min(3, 'write the item (at least 3 characters)').max(500, 'use at most 500 characters');
const guidance = paragraph().max(1000, 'use at most 1000 characters').nullish().transform((v) => v || null);

export const checklistItemSchema = z
  .discriminatedUnion('kind', [
    z.object({ kind: z.literal('tick'), key, prompt, guidance, stepKey }),
    z.object({ kind: z.literal('text'), key, prompt, guidance, stepKey }),
    z.object({ kind: z.literal('evidence'), key, prompt, guidance, stepKey }),
    z.object({ kind: z.literal('measurement'), key, prompt, guidance, stepKey, unit: line().min(1, 'give the unit').max(20), rule: acceptanceRuleSchema }),
  ])
  .superRefine((item, ctx) => {
    if (item.kind !== 'measurement') return;
    const expected = unitOfRule(item.rule);
    if (expected && expected !== item.unit) ctx.addIssue({ code: 'custom', path: ['unit'], message: `this rule is in ${expected}` });
  });
export type ChecklistItemInput = z.input<typeof checklistItemSchema>;
export type ChecklistItem = z.infer<typeof checklistItemSchema>;

export const checklistSchema = z.object({
  key,
  kind: z.enum(CHECKLIST_KINDS, { message: 'choose the kind of checklist' }),
  title: name().min(3, 'give the checklist a title').max(200),
  items: z.array(checklistItemSchema).min(1, 'add at least one item').max(100, 'at most 100 items'),
});
export type ChecklistInput = z.input<typeof checklistSchema>;
export type Checklist = z.infer<typeof checklistSchema>;

/** The unit a rule fixes, if it fixes one (a plain range takes whatever unit the author gives). */
export function unitOfRule(rule: AcceptanceRule): string | null {
  if (rule.type === 'preset') return LIMIT_PRESETS.find((p) => p.id === rule.presetId)?.unit ?? null;
  if (rule.type === 'earth-continuity') return 'Ω';
  if (rule.type === 'computed') return COMPUTED_QUANTITIES[rule.quantity].unit;
  return null;
}

/** Only a practical has a circuit under test; anywhere else a computed expectation could never be judged. */
export const COMPUTED_NEEDS_PRACTICAL =
  'a computed value needs the circuit under test, which only a practical has; use a fixed range or a published limit, or leave it to the assessor';

/** The first computed-value rule on a checklist that is not a practical assessment, named as its field. */
export function computedRuleOutsidePractical(checklists: readonly { kind: ChecklistKind; items: readonly { kind: string; rule?: { type: string } | null }[] }[]): string | null {
  for (const [ci, c] of checklists.entries()) {
    if (c.kind === 'practical-assessment') continue;
    const ii = c.items.findIndex((i) => i.rule?.type === 'computed');
    if (ii >= 0) return `checklists.${ci}.items.${ii}.rule`;
  }
  return null;
}
