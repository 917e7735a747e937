import type { LimitSource } from '../../shared/engine/limits.js';
import type { ItemKind } from '../../shared/schemas/checklists.js';
import type { Expectations } from '../../shared/practicals/expectations.js';
import { entryProblem, expectationOf } from '../../shared/practicals/entries.js';
import { describeRule } from '../../shared/procedures/judge.js';
import type { EntryView, RecordItemView } from '../../shared/practicals/views.js';
import type { RecordChecklist } from './checklist.js';
import type { EntryRow } from './records.repository.js';

export interface Lookups {
  names: Map<string, string>;
  instruments: Map<string, string>;
}

export function presentEntry(e: EntryRow, l: Lookups): EntryView {
  return {
    checked: e.checked, text: e.text, evidenceId: e.evidenceId, value: e.value, didNotTrip: e.didNotTrip, unit: e.unit,
    instrument: e.instrumentId ? { id: e.instrumentId, label: l.instruments.get(e.instrumentId) ?? 'unknown instrument' } : null,
    verdict: e.verdict as EntryView['verdict'], judgedBy: e.judgedBy as EntryView['judgedBy'], expected: e.expected, tolerance: e.tolerance,
    ruleText: e.ruleText, source: (e.source as LimitSource | null) ?? null, note: e.note,
    recordedAt: e.recordedAt.toISOString(), recordedByName: l.names.get(e.recordedBy) ?? 'unknown person', seq: e.seq ?? null,
  };
}

/** Every item of the checklist in order, with its entry, its expectation and what is still missing. */
export function presentItems(list: RecordChecklist, entries: EntryRow[], quantities: Expectations['quantities'] | null, l: Lookups) {
  const byItem = new Map(entries.map((e) => [e.itemId, e]));
  const items: RecordItemView[] = list.items.map((i, position) => {
    const entry = byItem.get(i.id);
    const exp = expectationOf(i.rule, quantities);
    const noExpectation = Boolean(exp && exp.expected === null);
    return {
      id: i.id, position, kind: i.kind as ItemKind, prompt: i.prompt, guidance: i.guidance, unit: i.unit, rule: i.rule, stepKey: i.stepKey,
      ruleText: i.rule ? describeRule(i.rule, i.unit ?? '') : null,
      expected: exp?.expected ?? null, tolerance: exp?.tolerance ?? null, noExpectation,
      entry: entry ? presentEntry(entry, l) : null,
      problem: entryProblem(i.kind, entry, noExpectation),
    };
  });
  return { items, progress: { done: items.filter((i) => i.problem === null).length, total: items.length } };
}

/** The items that stop a record being signed, as `fields` of a 422: one line per item, named by its prompt. */
export function failingItems(items: RecordItemView[]): Record<string, string> {
  return Object.fromEntries(items.filter((i) => i.problem).map((i) => [`items.${i.id}`, `${i.position + 1}. ${i.prompt}: ${i.problem}`]));
}
