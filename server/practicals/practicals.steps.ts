import type { StoredStep } from '../procedures/content.repository.js';
import type { PracticalStepView, RecordItemView } from '../../shared/practicals/views.js';

/**
 * The version's steps in order for the bench screen. The current step is the first whose hold point is
 * not yet witnessed or that has an item still to record; none once everything is done.
 */
export function presentSteps(steps: StoredStep[], witnessed: Set<string>, items: RecordItemView[]): PracticalStepView[] {
  const open = (s: StoredStep) => (s.holdPoint && !witnessed.has(s.key)) || items.some((i) => i.stepKey === s.key && i.entry === null);
  const current = steps.findIndex(open);
  return steps.map((s, i) => ({ key: s.key, number: i + 1, text: s.text, caution: s.caution, holdPoint: s.holdPoint, current: i === current }));
}
