import { diffArrays, diffWords } from 'diff';
import type { DiffRow, DiffSection, DiffSegment } from '../../shared/procedures/reports.js';
import { CATEGORY_LABELS, type ProcedureCategory } from '../../shared/schemas/procedures.js';
import { CHECKLIST_KIND_LABELS, ITEM_KIND_LABELS, type ChecklistKind, type ItemKind } from '../../shared/schemas/checklists.js';
import { describeRule } from '../../shared/procedures/judge.js';
import type { VersionContent } from './content.repository.js';
import type { VersionRow } from './procedures.repository.js';

/** A version as the lines a reader compares, section by section. */
export function linesOf(v: VersionRow, c: VersionContent): { title: string; lines: string[] }[] {
  return [
    { title: 'Title and category', lines: [v.title, CATEGORY_LABELS[v.category as ProcedureCategory] ?? v.category, `Review every ${v.reviewPeriodMonths} months`] },
    { title: 'Scope', lines: v.scope.split(/\n+/).filter(Boolean) },
    { title: 'Hazards', lines: v.hazards },
    { title: 'Personal protective equipment', lines: v.ppe },
    { title: 'Isolation and test equipment', lines: v.equipment },
    {
      title: 'Steps',
      lines: c.steps.flatMap((s, i) => [
        `${i + 1}. ${s.holdPoint ? '[HOLD POINT] ' : ''}${s.text}`,
        ...(s.caution ? [`    Caution: ${s.caution}`] : []),
      ]),
    },
    {
      title: 'Checklists',
      lines: c.checklists.flatMap((l) => [
        `${l.title} (${CHECKLIST_KIND_LABELS[l.kind as ChecklistKind] ?? l.kind})`,
        ...l.items.map((i, n) => `    ${n + 1}. [${ITEM_KIND_LABELS[i.kind as ItemKind] ?? i.kind}] ${i.prompt}${i.rule ? ` — ${describeRule(i.rule, i.unit ?? '')}` : ''}`),
      ]),
    },
  ];
}

/** Pairs removed lines with the added lines that replace them, marking the words that differ. */
export function diffLinesSideBySide(a: string[], b: string[]): DiffRow[] {
  const rows: DiffRow[] = [];
  const parts = diffArrays(a, b);
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i];
    if (!part.added && !part.removed) {
      for (const line of part.value) rows.push({ kind: 'same', left: [{ text: line }], right: [{ text: line }] });
      continue;
    }
    const next = parts[i + 1];
    if (part.removed && next?.added) {
      const n = Math.max(part.value.length, next.value.length);
      for (let k = 0; k < n; k++) rows.push(pair(part.value[k], next.value[k]));
      i++;
      continue;
    }
    for (const line of part.value) {
      rows.push(part.added ? { kind: 'added', left: null, right: [{ text: line, mark: 'added' }] } : { kind: 'removed', left: [{ text: line, mark: 'removed' }], right: null });
    }
  }
  return rows;
}

function pair(left: string | undefined, right: string | undefined): DiffRow {
  if (left === undefined) return { kind: 'added', left: null, right: [{ text: right!, mark: 'added' }] };
  if (right === undefined) return { kind: 'removed', left: [{ text: left, mark: 'removed' }], right: null };
  const l: DiffSegment[] = [];
  const r: DiffSegment[] = [];
  for (const w of diffWords(left, right)) {
    if (w.removed) l.push({ text: w.value, mark: 'removed' });
    else if (w.added) r.push({ text: w.value, mark: 'added' });
    else {
      l.push({ text: w.value });
      r.push({ text: w.value });
    }
  }
  return { kind: 'changed', left: l, right: r };
}

export function compareVersions(from: { v: VersionRow; c: VersionContent }, to: { v: VersionRow; c: VersionContent }): DiffSection[] {
  const a = linesOf(from.v, from.c);
  const b = linesOf(to.v, to.c);
  return a.map((section, i) => {
    const rows = diffLinesSideBySide(section.lines, b[i].lines);
    return { title: section.title, changed: rows.some((r) => r.kind !== 'same'), rows };
  });
}
