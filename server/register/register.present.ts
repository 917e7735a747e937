import { STATE_LABELS } from '../../shared/authorisations/kinds.js';
import type { RegisterRow } from '../../shared/register/views.js';
import { lastDay, localDate } from '../authorisations/dates.js';
import { isPriorOrigin } from '../authorisations/present.js';
import type { RegisterRowData } from './register.repository.js';

export function presentRow(r: RegisterRowData): RegisterRow {
  return {
    authorisationId: r.authorisationId, periodId: r.periodId,
    person: { id: r.personId, name: r.personName },
    site: { id: r.siteId, code: r.siteCode, name: r.siteName, timeZone: r.timeZone },
    scope: { id: r.scopeId, code: r.scopeCode, title: r.scopeTitle, allowsLiveWork: r.allowsLiveWork, maxVoltageV: r.maxVoltageV, maxCurrentA: r.maxCurrentA },
    state: r.state, stateLabel: STATE_LABELS[r.state], since: r.since.toISOString(),
    validFrom: localDate(r.startsAt, r.timeZone), validUntil: lastDay(r.endsAt, r.timeZone), endsAt: r.endsAt.toISOString(),
    recordedFromBefore: isPriorOrigin(r.origin),
  };
}

export const CSV_COLUMNS = [
  'Person', 'Site', 'Scope code', 'Scope', 'Live work', 'Max voltage (V)', 'Max current (A)', 'State', 'Since', 'Valid from', 'Valid until', 'Recorded from before the portal', 'Authorisation id',
];

export function csvLine(r: RegisterRow): (string | number)[] {
  return [
    r.person.name, r.site.code, r.scope.code, r.scope.title, r.scope.allowsLiveWork ? 'yes' : 'no', r.scope.maxVoltageV, r.scope.maxCurrentA,
    r.stateLabel, r.since, r.validFrom, r.validUntil, r.recordedFromBefore ? 'yes' : 'no', r.authorisationId,
  ];
}
