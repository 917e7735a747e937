import type { SignatureRow } from '../signatures/signatures.repository.js';
import { presentSignature } from '../signatures/signatures.service.js';
import type { AckState, ChangeClass, ProcedureCategory, VersionStatus } from '../../shared/schemas/procedures.js';
import type { ChecklistKind, ItemKind } from '../../shared/schemas/checklists.js';
import { describeRule } from '../../shared/procedures/judge.js';
import type { ChangeCheck } from '../../shared/procedures/change-class.js';
import type { ChecklistView, ProcedureRowView, VersionSummaryView, VersionView } from '../../shared/procedures/views.js';
import type { StoredChecklist, VersionContent } from './content.repository.js';
import type { ProcedureRow, VersionRow } from './procedures.repository.js';
import type { listProcedures } from './list.repository.js';

const iso = (d: Date | null) => (d ? d.toISOString() : null);
type Names = Map<string, string>;
const nameOf = (names: Names, id: string | null) => (id ? (names.get(id) ?? 'unknown person') : null);

/** Everyone a version row names, for one batched name look-up. */
export function peopleIn(v: VersionRow): string[] {
  return [v.authorId, ...v.editorIds, v.approvedBy, v.returnedBy, v.withdrawnBy].filter((x): x is string => Boolean(x));
}

export function presentChecklists(lists: StoredChecklist[]): ChecklistView[] {
  return lists.map((c) => ({
    id: c.id ?? null, key: c.key, kind: c.kind as ChecklistKind, title: c.title,
    items: c.items.map((i) => ({
      id: i.id ?? null, key: i.key, kind: i.kind as ItemKind, prompt: i.prompt, guidance: i.guidance, unit: i.unit, rule: i.rule, stepKey: i.stepKey,
      ruleText: i.rule ? describeRule(i.rule, i.unit ?? '') : null,
    })),
  }));
}

export interface VersionExtras {
  procedure: ProcedureRow;
  content: VersionContent;
  names: Names;
  basedOn: VersionRow | null;
  changeCheck: ChangeCheck | null;
  approval: SignatureRow | null;
  mine: SignatureRow | null;
  siteTimeZone: string;
  today: string;
}

export function presentVersion(v: VersionRow, x: VersionExtras): VersionView {
  return {
    id: v.id, procedureId: v.procedureId, code: x.procedure.code, number: v.number, status: v.status as VersionStatus,
    inForce: v.status === 'published', title: v.title, category: v.category as ProcedureCategory, reviewPeriodMonths: v.reviewPeriodMonths,
    scope: v.scope, hazards: v.hazards, ppe: v.ppe, equipment: v.equipment,
    steps: x.content.steps, checklists: presentChecklists(x.content.checklists),
    changeClass: v.changeClass as ChangeClass | null, changeSummary: v.changeSummary, rereadDays: v.rereadDays,
    author: { id: v.authorId, name: nameOf(x.names, v.authorId)! },
    editors: v.editorIds.map((id) => ({ id, name: nameOf(x.names, id)! })),
    basedOn: x.basedOn ? { id: x.basedOn.id, number: x.basedOn.number } : null,
    changeCheck: x.changeCheck,
    createdAt: v.createdAt.toISOString(), updatedAt: v.updatedAt.toISOString(), submittedAt: iso(v.submittedAt),
    returned: v.returnedAt && v.status === 'draft' ? { byName: nameOf(x.names, v.returnedBy)!, at: v.returnedAt.toISOString(), comment: v.returnComment ?? '' } : null,
    approval: x.approval ? presentSignature(x.approval) : null,
    publishedAt: iso(v.publishedAt), reviewDueOn: v.reviewDueOn,
    reviewOverdue: v.status === 'published' && v.reviewDueOn !== null && v.reviewDueOn < x.today,
    supersededAt: iso(v.supersededAt),
    withdrawn: v.withdrawnAt ? { at: v.withdrawnAt.toISOString(), byName: nameOf(x.names, v.withdrawnBy)!, reason: v.withdrawnReason ?? '' } : null,
    siteTimeZone: x.siteTimeZone,
    myAcknowledgement: x.mine ? presentSignature(x.mine) : null,
  };
}

export function presentSummary(v: VersionRow, names: Names): VersionSummaryView {
  return {
    id: v.id, number: v.number, status: v.status as VersionStatus, title: v.title, changeClass: v.changeClass as ChangeClass | null,
    changeSummary: v.changeSummary, authorName: nameOf(names, v.authorId)!, approverName: nameOf(names, v.approvedBy),
    createdAt: v.createdAt.toISOString(), submittedAt: iso(v.submittedAt), publishedAt: iso(v.publishedAt),
    supersededAt: iso(v.supersededAt), withdrawnAt: iso(v.withdrawnAt),
  };
}

type ListRow = Awaited<ReturnType<typeof listProcedures>>['items'][number];

/** `today` is the reader's local date: it tells a re-read still due from an overdue one. */
export function presentRow(r: ListRow, today: string): ProcedureRowView {
  let myState: AckState | null = null;
  if (r.publishedVersionId) {
    if (r.myAckNumber !== null && r.ackFromNumber !== null && r.myAckNumber >= r.ackFromNumber) myState = 'acknowledged';
    else if (r.myDueOn) myState = r.myDueOn < today ? 'overdue' : 're-read-due';
    else myState = r.myAckNumber !== null ? 'older-version' : 'not-acknowledged';
  }
  return {
    id: r.id, code: r.code, title: r.title, category: r.category as ProcedureCategory, status: r.status as VersionStatus,
    versionId: r.versionId, versionNumber: r.versionNumber, publishedVersionId: r.publishedVersionId, publishedNumber: r.publishedNumber,
    ownerName: r.ownerName, updatedAt: new Date(r.updatedAt).toISOString(), reviewDueOn: r.reviewDueOn, reviewOverdue: r.reviewOverdue,
    myState, myDueOn: r.myDueOn,
  };
}
