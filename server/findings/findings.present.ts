import { FINDING_SEVERITY_LABELS, FINDING_STATUS_LABELS, type FindingSeverity, type FindingStatus, type FindingTarget } from '../../shared/register/kinds.js';
import type { FindingView } from '../../shared/register/views.js';
import type { FullFinding } from './findings.repository.js';

export function presentFinding({ finding: f, siteName, raisedBy, answeredBy, closedBy }: FullFinding): FindingView {
  const severity = f.severity as FindingSeverity;
  const status = f.status as FindingStatus;
  return {
    id: f.id, entity: f.entity as FindingTarget, entityId: f.entityId, recordLabel: f.recordLabel, siteId: f.siteId, siteName,
    severity, severityLabel: FINDING_SEVERITY_LABELS[severity], status, statusLabel: FINDING_STATUS_LABELS[status], text: f.text,
    raisedBy, raisedAt: f.raisedAt.toISOString(), response: f.response, answeredBy, answeredAt: f.answeredAt?.toISOString() ?? null,
    closingNote: f.closingNote, closedBy, closedAt: f.closedAt?.toISOString() ?? null,
  };
}

export const FINDING_CSV_COLUMNS = ['Raised at', 'Raised by', 'Severity', 'Status', 'Record', 'Record kind', 'Record id', 'Site', 'Finding', 'Answer', 'Answered by', 'Answered at', 'Closing note', 'Closed by', 'Closed at'];

export function findingCsvLine(f: FindingView): string[] {
  return [
    f.raisedAt, f.raisedBy, f.severityLabel, f.statusLabel, f.recordLabel, f.entity, f.entityId, f.siteName ?? '', f.text,
    f.response ?? '', f.answeredBy ?? '', f.answeredAt ?? '', f.closingNote ?? '', f.closedBy ?? '', f.closedAt ?? '',
  ];
}
